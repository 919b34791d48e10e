/**
 * The bench sheet's fonts: DejaVu Sans regular and bold from `fonts/` (full TTFs, so µ ° ±
 * Ø ≤ and names like "Zoë Ødegård" print; pdfkit embeds TTF but not the @fontsource
 * files, which cover one script each). Each file is parsed once
 * per process with fontkit and the parsed font handed to pdfkit, instead of pdfkit parsing
 * the TTF again for every document (~33 ms per font per sheet).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import * as fontkit from 'fontkit';
import type {} from 'pdfkit';

const FONTS_DIR = path.resolve(import.meta.dirname, '../../../fonts');

export const SHEET_FONTS = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
} as const;

export type SheetFont = keyof typeof SHEET_FONTS;

let parsed: Record<SheetFont, fontkit.Font> | null = null;

function fonts(): Record<SheetFont, fontkit.Font> {
  parsed ??= {
    regular: withLayoutCache(fontkit.create(readFileSync(path.join(FONTS_DIR, SHEET_FONTS.regular)))),
    bold: withLayoutCache(fontkit.create(readFileSync(path.join(FONTS_DIR, SHEET_FONTS.bold)))),
  };
  return parsed;
}

type LayoutRun = { glyphs: unknown[]; positions: Record<string, number>[] };

/** What pdfkit reads of a run: glyphs, positions, and an advance width summed from the positions. */
class CopiedRun {
  constructor(
    readonly glyphs: unknown[],
    readonly positions: Record<string, number>[],
  ) {}

  get advanceWidth(): number {
    let width = 0;
    for (const p of this.positions) width += p['xAdvance']!;
    return width;
  }
}

const LAYOUT_CACHE_MAX = 20_000;

/**
 * fontkit's shaping of each word (GSUB/GPOS lookups) was most of a sheet's time, and pdfkit
 * only caches it per document; the same words come back on every sheet, so the shaped runs
 * are kept per process. pdfkit scales a run's positions in place, so every call gets its
 * own copy of them (the glyphs are shared, as fontkit shares them anyway).
 */
function withLayoutCache(font: fontkit.Font): fontkit.Font {
  const f = font as unknown as { layout: (text: unknown, features?: unknown, ...rest: unknown[]) => LayoutRun };
  const layout = f.layout.bind(font);
  const cache = new Map<string, LayoutRun>();
  f.layout = (text, features, ...rest) => {
    if (typeof text !== 'string' || rest.length > 0) return layout(text, features, ...rest);
    const key = features === undefined ? text : `${text}\u0000${JSON.stringify(features)}`;
    let run = cache.get(key);
    if (!run) {
      const fresh = layout(text, features);
      run = { glyphs: fresh.glyphs, positions: fresh.positions.map((p) => ({ ...p })) };
      if (cache.size >= LAYOUT_CACHE_MAX) cache.clear();
      cache.set(key, run);
    }
    return new CopiedRun(
      run.glyphs,
      run.positions.map((p) => ({ ...p })),
    ) as unknown as LayoutRun;
  };
  return font;
}

/** Registers 'regular' and 'bold' on a new document. */
export function registerSheetFonts(doc: PDFKit.PDFDocument): void {
  for (const [name, font] of Object.entries(fonts())) {
    // pdfkit accepts a parsed fontkit font (it checks for `layout`); its types only know sources.
    doc.registerFont(name, font as unknown as Buffer);
  }
  doc.font('regular');
}

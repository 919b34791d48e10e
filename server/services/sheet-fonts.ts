/**
 * The bench sheet's fonts: DejaVu Sans regular and bold from `fonts/` (full TTFs, so µ ° ±
 * Ø ≤ and names like "Zoë Ødegård" print; toolchain pitfall 13). Each file is parsed once
 * per process with fontkit and the parsed font handed to pdfkit, instead of pdfkit parsing
 * the TTF again for every document (~33 ms per font per sheet).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import * as fontkit from 'fontkit';
import type {} from 'pdfkit';

const FONTS_DIR = path.resolve(import.meta.dirname, '../../fonts');

export const SHEET_FONTS = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
} as const;

export type SheetFont = keyof typeof SHEET_FONTS;

let parsed: Record<SheetFont, fontkit.Font> | null = null;

function fonts(): Record<SheetFont, fontkit.Font> {
  parsed ??= {
    regular: fontkit.create(readFileSync(path.join(FONTS_DIR, SHEET_FONTS.regular))),
    bold: fontkit.create(readFileSync(path.join(FONTS_DIR, SHEET_FONTS.bold))),
  };
  return parsed;
}

/** Registers 'regular' and 'bold' on a new document. */
export function registerSheetFonts(doc: PDFKit.PDFDocument): void {
  for (const [name, font] of Object.entries(fonts())) {
    // pdfkit accepts a parsed fontkit font (it checks for `layout`); its types only know sources.
    doc.registerFont(name, font as unknown as Buffer);
  }
  doc.font('regular');
}

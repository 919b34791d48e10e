/** Reading bench sheets back in tests: the PDF's text, page size, and the QR code it carries. */
import jsQR from 'jsqr';
import { PDFParse } from 'pdf-parse';
import { PNG } from 'pngjs';
import type { Agent } from '../support/test-app';

/** GET a sheet as raw bytes (supertest would otherwise try to parse the PDF as text). */
export function getSheet(agent: Agent, recipeId: number, version: number) {
  return agent
    .get(`/api/recipes/${recipeId}/versions/${version}/sheet.pdf`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
}

export interface ReadSheet {
  text: string;
  /** The text of each page, in order. */
  pageTexts: string[];
  pages: number;
  /** Page size in points of each page. */
  sizes: { width: number; height: number }[];
  /** Every QR code found in the embedded images. */
  qrTexts: string[];
}

function rgba(image: { data: Uint8Array; width: number; height: number }): Uint8ClampedArray {
  const { data, width, height } = image;
  // PNG-encoded bytes, or raw pixels (1, 3 or 4 channels) as pdf.js decoded them.
  if (data[0] === 0x89 && data[1] === 0x50) {
    const png = PNG.sync.read(Buffer.from(data));
    return new Uint8ClampedArray(png.data.buffer, png.data.byteOffset, png.data.length);
  }
  const channels = data.length / (width * height);
  const out = new Uint8ClampedArray(width * height * 4);
  for (let i = 0; i < width * height; i += 1) {
    const g = channels === 1 ? data[i]! : 0;
    out[i * 4] = channels === 1 ? g : data[i * channels]!;
    out[i * 4 + 1] = channels === 1 ? g : data[i * channels + 1]!;
    out[i * 4 + 2] = channels === 1 ? g : data[i * channels + 2]!;
    out[i * 4 + 3] = 255;
  }
  return out;
}

export async function readSheet(pdf: Buffer): Promise<ReadSheet> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const text = await parser.getText();
    const info = await parser.getInfo({ parsePageInfo: true });
    const images = await parser.getImage({ imageThreshold: 50 });
    const qrTexts: string[] = [];
    for (const page of images.pages) {
      for (const image of page.images) {
        const found = jsQR(rgba(image), image.width, image.height);
        if (found) qrTexts.push(found.data);
      }
    }
    return {
      text: text.text,
      pageTexts: text.pages.map((p) => p.text),
      pages: info.total,
      sizes: info.pages.map((p) => ({ width: Math.round(p.width), height: Math.round(p.height) })),
      qrTexts,
    };
  } finally {
    await parser.destroy();
  }
}

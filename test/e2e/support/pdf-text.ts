/** The text of a PDF (bench sheets), read with pdf-parse (a dev dependency: no poppler needed). */
import { PDFParse } from 'pdf-parse';

export async function readPdfText(pdf: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

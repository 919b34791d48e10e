/** The QR code printed beside the check code: a PNG of `<origin>/check/<CODE>`. */
import QRCode from 'qrcode';
import sharp from 'sharp';

/**
 * Error correction M survives a smudged or creased sheet; the 4-module quiet zone is what
 * phone cameras need. 8 px per module keeps it crisp when the PDF is printed at 300 dpi.
 */
export function qrPng(text: string): Promise<Buffer> {
  const known = recent.get(text);
  if (known) return known;
  const made = QRCode.toBuffer(text, { type: 'png', errorCorrectionLevel: 'M', margin: 4, scale: 8, color: { dark: '#000000', light: '#ffffff' } }).then(
    // qrcode writes RGBA; pdfkit must unpack every pixel of a PNG with alpha to split it off,
    // while one grey channel without alpha goes into the PDF as it is.
    (rgba) => sharp(rgba).removeAlpha().toColourspace('b-w').png().toBuffer(),
  );
  // Each version prints the same check link every time: keep the last few hundred PNGs
  // (~3 kB each) instead of encoding again (~15 ms of each sheet, npm run bench).
  if (recent.size >= RECENT_MAX) recent.delete(recent.keys().next().value!);
  recent.set(text, made);
  made.catch(() => recent.delete(text));
  return made;
}

const RECENT_MAX = 500;
const recent = new Map<string, Promise<Buffer>>();

/** The QR code printed beside the check code: a PNG of `<origin>/check/<CODE>`. */
import QRCode from 'qrcode';

/**
 * Error correction M survives a smudged or creased sheet; the 4-module quiet zone is what
 * phone cameras need. 8 px per module keeps it crisp when the PDF is printed at 300 dpi.
 */
export function qrPng(text: string): Promise<Buffer> {
  return QRCode.toBuffer(text, { type: 'png', errorCorrectionLevel: 'M', margin: 4, scale: 8, color: { dark: '#000000', light: '#ffffff' } });
}

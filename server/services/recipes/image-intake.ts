/**
 * What an uploaded photo must pass before it is stored: its type is sniffed from the
 * bytes (never taken from the name or the declared type), it must be JPEG, PNG or WebP
 * (SVG is refused: it can carry scripts), the declared type and the file name's extension
 * must agree with the bytes, and it must decode. Then its size, SHA-256 and a thumbnail.
 */
import { createHash } from 'node:crypto';
import path from 'node:path';
import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { AppError } from '../../app-error';

/** Sniffed type → the extensions and declared types that agree with it. */
const ACCEPTED: Record<string, { format: string; extensions: string[]; declared: string[] }> = {
  'image/jpeg': { format: 'jpeg', extensions: ['.jpg', '.jpeg', '.jpe', '.jfif'], declared: ['image/jpeg', 'image/jpg', 'image/pjpeg'] },
  'image/png': { format: 'png', extensions: ['.png'], declared: ['image/png', 'image/x-png'] },
  'image/webp': { format: 'webp', extensions: ['.webp'], declared: ['image/webp'] },
};

/** Browsers send this when they do not know the type: it claims nothing, so it disagrees with nothing. */
const UNDECLARED = 'application/octet-stream';

/** Decompression bombs: a small file that decodes to a huge bitmap. 40 megapixels covers any camera we expect. */
const MAX_PIXELS = 40_000_000;

export const THUMBNAIL_WIDTH = 320;

export interface Upload {
  bytes: Buffer;
  fileName: string;
  declaredType: string;
}

export interface AcceptedImage {
  mimeType: string;
  width: number;
  height: number;
  sha256: string;
  thumbnail: Buffer;
  thumbnailMimeType: string;
  thumbnailSha256: string;
}

function refuse(message: string): AppError {
  return AppError.validation([{ path: 'file', message }]);
}

export function sha256Hex(bytes: Buffer): string {
  return createHash('sha256').update(bytes).digest('hex');
}

export async function acceptImage(upload: Upload): Promise<AcceptedImage> {
  if (upload.bytes.length === 0) throw refuse('The file is empty.');
  const sniffed = await fileTypeFromBuffer(upload.bytes);
  const accepted = sniffed ? ACCEPTED[sniffed.mime] : undefined;
  if (!sniffed || !accepted) {
    throw new AppError(415, 'UNSUPPORTED_MEDIA_TYPE', [
      {
        path: 'file',
        message: `Only JPEG, PNG and WebP photos can be attached; the bytes of "${upload.fileName}" are ${sniffed ? `${sniffed.mime}` : 'not an image of those kinds'}.`,
      },
    ]);
  }
  const declared = upload.declaredType.toLowerCase().split(';')[0]!.trim();
  if (declared !== UNDECLARED && !accepted.declared.includes(declared)) {
    throw refuse(`The file was sent as ${declared || 'an unknown type'}, but its bytes are ${sniffed.mime}. Send the photo as it came from the camera.`);
  }
  const extension = path.extname(upload.fileName).toLowerCase();
  if (!accepted.extensions.includes(extension)) {
    throw refuse(`The file name "${upload.fileName}" does not match its content (${sniffed.mime}); name it ${accepted.extensions[0]}.`);
  }

  let width: number;
  let height: number;
  let thumbnail: Buffer;
  try {
    const image = sharp(upload.bytes, { limitInputPixels: MAX_PIXELS, failOn: 'error' });
    const meta = await image.metadata();
    if (meta.format !== accepted.format) throw new Error(`decoder sees ${meta.format}`);
    // As shown: EXIF orientation applied.
    width = meta.autoOrient.width;
    height = meta.autoOrient.height;
    // Decoding the whole image for the thumbnail also proves it is not truncated or corrupt.
    thumbnail = await image.autoOrient().resize({ width: THUMBNAIL_WIDTH, withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
  } catch (err) {
    const tooBig = /pixel limit/i.test(String((err as Error)?.message));
    throw refuse(
      tooBig
        ? `The image is larger than ${MAX_PIXELS / 1_000_000} megapixels; scale it down before attaching it.`
        : `"${upload.fileName}" could not be read as an image: it looks damaged or incomplete.`,
    );
  }
  return {
    mimeType: sniffed.mime,
    width,
    height,
    sha256: sha256Hex(upload.bytes),
    thumbnail,
    thumbnailMimeType: 'image/webp',
    thumbnailSha256: sha256Hex(thumbnail),
  };
}

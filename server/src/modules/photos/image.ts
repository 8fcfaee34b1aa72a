import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { PayloadTooLargeError, UnprocessableError, UnsupportedMediaTypeError } from '../../lib/errors';

/** Decoding bombs stop here: 50 megapixels is well above any phone camera. */
export const MAX_INPUT_PIXELS = 50_000_000;
/** Room photos are for the record, not for print: the long edge is capped. */
const MAX_EDGE = 2560;
const ACCEPTED = new Set(['image/jpeg', 'image/png', 'image/webp']);
const HEIC = new Set(['image/heic', 'image/heif', 'image/heic-sequence', 'image/heif-sequence']);

export interface CleanPhoto {
  bytes: Buffer;
  contentType: 'image/jpeg';
  width: number;
  height: number;
}

/**
 * Checks the content by its magic bytes (never the name or the declared type), then
 * re-encodes it as JPEG: rotated upright by its EXIF orientation, with every metadata
 * block (EXIF, GPS, XMP, ICC, comments) dropped — sharp writes none unless asked.
 */
export async function cleanPhoto(input: Buffer): Promise<CleanPhoto> {
  const type = await fileTypeFromBuffer(input);
  if (type && HEIC.has(type.mime)) {
    throw new UnsupportedMediaTypeError(
      'HEIC photos are not accepted yet. Save or share the photo as JPEG and upload that.',
    );
  }
  if (!type || !ACCEPTED.has(type.mime)) {
    throw new UnsupportedMediaTypeError(
      'This file is not a JPEG, PNG or WebP photo (its content was checked, not its name). Upload a photo in one of those formats.',
    );
  }
  let meta: sharp.Metadata;
  try {
    meta = await sharp(input).metadata();
  } catch {
    throw new UnprocessableError('The photo could not be read: the file looks damaged.');
  }
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_INPUT_PIXELS) {
    throw new PayloadTooLargeError(`The photo has more than ${MAX_INPUT_PIXELS / 1_000_000} megapixels.`);
  }
  try {
    const { data, info } = await sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' })
      .rotate()
      .resize({ width: MAX_EDGE, height: MAX_EDGE, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 82 })
      .toBuffer({ resolveWithObject: true });
    return { bytes: data, contentType: 'image/jpeg', width: info.width, height: info.height };
  } catch {
    throw new UnprocessableError('The photo could not be read: the file looks damaged.');
  }
}

/** A name for display only: no folders, no control or bidi characters, never used as a path. */
export function displayName(original: string | undefined): string {
  const base = (original ?? '').split(/[\\/]/).pop() ?? '';
  const clean = base
    .normalize('NFC')
    // eslint-disable-next-line no-control-regex -- removing control characters is the point
    .replace(/[\u0000-\u001f\u007f-\u009f<>:"|?*\u200e\u200f\u202a-\u202e\u2066-\u2069]/g, '')
    .replace(/^[.\s]+/, '')
    .trim()
    .slice(0, 120);
  return clean || 'photo';
}

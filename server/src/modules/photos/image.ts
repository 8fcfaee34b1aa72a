import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { PayloadTooLargeError, UnprocessableError, UnsupportedMediaTypeError } from '../../lib/errors';

/** Decoding bombs stop here: 50 megapixels is well above any phone camera. */
export const MAX_INPUT_PIXELS = 50_000_000;
/** Room photos are for the record, not for print: the long edge is capped. */
const MAX_EDGE = 2560;
/** A logo prints at most 190 × 70 pt on the cover: 1200 px is ample for print at any size it gets. */
export const LOGO_MAX_EDGE = 1200;
const ACCEPTED = new Set(['image/jpeg', 'image/png', 'image/webp']);
const HEIC = new Set(['image/heic', 'image/heif', 'image/heic-sequence', 'image/heif-sequence']);

export interface CleanPhoto {
  bytes: Buffer;
  contentType: 'image/jpeg';
  width: number;
  height: number;
}

export interface CleanLogo {
  bytes: Buffer;
  contentType: 'image/png';
  width: number;
  height: number;
}

/** What an upload is called in the messages, how large its long edge may stay, and what it is saved as. */
interface ImageRules {
  readonly what: 'photo' | 'logo';
  readonly maxEdge: number;
  readonly output: 'jpeg' | 'png';
}

/**
 * Checks the content by its magic bytes (never the name or the declared type) and its size in pixels, then
 * re-encodes it: rotated upright by its EXIF orientation, scaled to the long edge, with every metadata
 * block (EXIF, GPS, XMP, ICC, comments) dropped — sharp writes none unless asked.
 */
async function cleanImage(input: Buffer, rules: ImageRules): Promise<{ data: Buffer; width: number; height: number }> {
  const { what } = rules;
  const type = await fileTypeFromBuffer(input);
  if (type && HEIC.has(type.mime)) {
    throw new UnsupportedMediaTypeError(
      `HEIC ${what}s are not accepted yet. Save or share the ${what} as JPEG or PNG and upload that.`,
    );
  }
  if (!type || !ACCEPTED.has(type.mime)) {
    throw new UnsupportedMediaTypeError(
      `This file is not a JPEG, PNG or WebP ${what} (its content was checked, not its name). Upload a ${what} in one of those formats.`,
    );
  }
  let meta: sharp.Metadata;
  try {
    meta = await sharp(input).metadata();
  } catch {
    throw new UnprocessableError(`The ${what} could not be read: the file looks damaged.`);
  }
  if ((meta.width ?? 0) * (meta.height ?? 0) > MAX_INPUT_PIXELS) {
    throw new PayloadTooLargeError(`The ${what} has more than ${MAX_INPUT_PIXELS / 1_000_000} megapixels.`);
  }
  try {
    const image = sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' })
      .rotate()
      .resize({ width: rules.maxEdge, height: rules.maxEdge, fit: 'inside', withoutEnlargement: true });
    const encoded = rules.output === 'jpeg' ? image.jpeg({ quality: 82 }) : image.png({ compressionLevel: 9 });
    const { data, info } = await encoded.toBuffer({ resolveWithObject: true });
    return { data, width: info.width, height: info.height };
  } catch {
    throw new UnprocessableError(`The ${what} could not be read: the file looks damaged.`);
  }
}

/** A room photo: JPEG, long edge at most 2560 px (for the record, not for print). */
export async function cleanPhoto(input: Buffer): Promise<CleanPhoto> {
  const { data, width, height } = await cleanImage(input, { what: 'photo', maxEdge: MAX_EDGE, output: 'jpeg' });
  return { bytes: data, contentType: 'image/jpeg', width, height };
}

/** The company's logo: PNG (a transparent background stays transparent), long edge at most 1200 px. */
export async function cleanLogo(input: Buffer): Promise<CleanLogo> {
  const { data, width, height } = await cleanImage(input, { what: 'logo', maxEdge: LOGO_MAX_EDGE, output: 'png' });
  return { bytes: data, contentType: 'image/png', width, height };
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

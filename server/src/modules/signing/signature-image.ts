import sharp from 'sharp';
import { SIGNATURE_IMAGE_MAX_BYTES, SIGNATURE_IMAGE_MAX_PX } from '@contract';
import { ValidationError } from '../../lib/errors';

const PNG_MAGIC = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
const PREFIX = 'data:image/png;base64,';

const refuse = (message: string): never => {
  throw new ValidationError([{ path: 'image', message }], 'The drawn signature could not be used.');
};

/**
 * A drawn signature as the drawing pad sends it (`data:image/png;base64,…`), checked and made safe to
 * store: a PNG by its bytes (not by its label), at most SIGNATURE_IMAGE_MAX_BYTES and
 * SIGNATURE_IMAGE_MAX_PX, not blank, and re-encoded by sharp so nothing but the pixels is kept (no text
 * chunks, no trailing data). Anything else is a 400 on `image`.
 */
export async function checkSignatureImage(dataUrl: string): Promise<{ png: Buffer; width: number; height: number }> {
  if (!dataUrl.startsWith(PREFIX)) refuse('Send the drawing as a PNG image.');
  const base64 = dataUrl.slice(PREFIX.length);
  if (!/^[A-Za-z0-9+/]+={0,2}$/.test(base64)) refuse('The drawing is not valid base64.');
  const bytes = Buffer.from(base64, 'base64');
  if (bytes.length > SIGNATURE_IMAGE_MAX_BYTES) refuse('The drawing is too large.');
  if (bytes.length < PNG_MAGIC.length || !bytes.subarray(0, PNG_MAGIC.length).equals(PNG_MAGIC))
    refuse('Send the drawing as a PNG image.');
  let meta: sharp.Metadata;
  let stats: sharp.Stats;
  try {
    const image = sharp(bytes, { limitInputPixels: SIGNATURE_IMAGE_MAX_PX.width * SIGNATURE_IMAGE_MAX_PX.height });
    meta = await image.metadata();
    stats = await image.stats();
  } catch {
    return refuse('The drawing could not be read as an image.');
  }
  const { width = 0, height = 0 } = meta;
  if (meta.format !== 'png') refuse('Send the drawing as a PNG image.');
  if (width < 40 || height < 20 || width > SIGNATURE_IMAGE_MAX_PX.width || height > SIGNATURE_IMAGE_MAX_PX.height)
    refuse(
      `The drawing must be between 40 × 20 and ${SIGNATURE_IMAGE_MAX_PX.width} × ${SIGNATURE_IMAGE_MAX_PX.height} pixels.`,
    );
  // Blank: fully transparent (the pad's background), or one flat colour everywhere.
  const alpha = meta.hasAlpha ? stats.channels[stats.channels.length - 1] : undefined;
  const flat = stats.channels.every((c) => c.min === c.max);
  if ((alpha && alpha.max === 0) || flat) refuse('Draw your signature in the box first.');
  const png = await sharp(bytes).png({ compressionLevel: 9 }).toBuffer();
  return { png, width, height };
}

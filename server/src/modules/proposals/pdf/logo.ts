import sharp from 'sharp';
import type { Storage } from '../../../services/storage';

/** The logo as react-pdf takes it. */
export interface Logo {
  readonly data: Buffer;
  readonly format: 'png';
}

/**
 * The company's logo as it was stored when the version was issued, made into a PNG of at most 600 × 240 px
 * (2× the space the cover gives it), so any image the upload accepted prints the same way and a large one
 * does not swell the file. No key, or nothing stored under it → null: the cover prints the name alone.
 * Bytes that are not an image are an error (the render is tried again, then marked failed).
 */
export async function loadLogo(storage: Storage, key: string | null): Promise<Logo | null> {
  if (key === null) return null;
  const bytes = await storage.get(key);
  if (bytes === null) return null;
  const data = await sharp(bytes)
    .rotate()
    .resize({ width: 600, height: 240, fit: 'inside', withoutEnlargement: true })
    .png()
    .toBuffer();
  return { data, format: 'png' };
}

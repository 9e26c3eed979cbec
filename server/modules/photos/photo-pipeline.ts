import sharp, { type Metadata } from 'sharp';
import { createHash } from 'node:crypto';
import { payloadTooLarge, unsupportedMedia } from '../../errors';

/** Refuse images over 50 megapixels: a small file can decode to gigabytes (a decompression bomb). */
export const MAX_INPUT_PIXELS = 50_000_000;
const ACCEPTED = new Set(['jpeg', 'png', 'webp']);

export interface ProcessedPhoto {
  display: Buffer;
  thumb: Buffer;
  width: number;
  height: number;
  sha256: string;
}

/** Decodes the upload to prove it is an image, applies its orientation, and writes two JPEG sizes
 * with every piece of metadata (EXIF, GPS location, XMP, ICC comments) left behind. */
export async function processPhoto(input: Buffer | string, originalName: string): Promise<ProcessedPhoto> {
  let meta: Metadata;
  try {
    meta = await sharp(input, { limitInputPixels: false }).metadata();
  } catch {
    throw unsupportedMedia(`${originalName} is not a JPEG, PNG or WebP image.`);
  }
  if (!meta.format || !ACCEPTED.has(meta.format)) {
    throw unsupportedMedia(`${originalName} is ${meta.format ?? 'not an image'}; Compline takes JPEG, PNG or WebP.`);
  }
  const pixels = (meta.width ?? 0) * (meta.height ?? 0);
  if (pixels > MAX_INPUT_PIXELS || pixels === 0) {
    throw payloadTooLarge(`${originalName} is ${meta.width}×${meta.height} pixels; the limit is 50 megapixels.`);
  }
  try {
    const base = sharp(input, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).rotate();
    const [display, thumb] = await Promise.all([
      base.clone().resize({ width: 1600, height: 1600, fit: 'inside', withoutEnlargement: true }).jpeg({ quality: 82 }).toBuffer({ resolveWithObject: true }),
      base.clone().resize({ width: 320, height: 240, fit: 'cover' }).jpeg({ quality: 72 }).toBuffer(),
    ]);
    return {
      display: display.data,
      thumb,
      width: display.info.width,
      height: display.info.height,
      sha256: createHash('sha256').update(display.data).digest('hex'),
    };
  } catch {
    throw unsupportedMedia(`${originalName} could not be decoded as an image (damaged or disguised file).`);
  }
}

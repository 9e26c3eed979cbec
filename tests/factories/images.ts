import sharp from 'sharp';

/** Image files for upload tests, made with sharp in memory. */

/** Where the test camera claims to have stood (an invented point off the demo town's coast). */
export const GPS_EXIF = {
  GPSLatitudeRef: 'N',
  GPSLatitude: '44/1 42/1 0/1',
  GPSLongitudeRef: 'W',
  GPSLongitude: '61/1 24/1 0/1',
  GPSMapDatum: 'WGS-84',
  GPSSatellites: 'GPS 07',
};

/** A small JPEG carrying a camera make and a GPS block (EXIF IFD3). */
export function jpegWithGps(width = 96, height = 64): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 150, g: 110, b: 70 } } })
    .withExif({ IFD0: { Make: 'Factory Camera', Software: 'compline-tests' }, IFD3: GPS_EXIF })
    .jpeg({ quality: 90 })
    .toBuffer();
}

/** A plain JPEG of one colour. */
export function plainJpeg(width = 80, height = 60, colour = '#4a6b8a'): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: colour } })
    .jpeg()
    .toBuffer();
}

/** A JPEG whose pixels are stored landscape with EXIF orientation 6 ("rotate 90° clockwise to
 * view"): a viewer that honours the tag shows it portrait. */
export function jpegWithOrientation6(storedWidth = 120, storedHeight = 40): Promise<Buffer> {
  return sharp({ create: { width: storedWidth, height: storedHeight, channels: 3, background: '#8a4a3c' } })
    .withMetadata({ orientation: 6 })
    .jpeg()
    .toBuffer();
}

/** A text file, as if someone renamed notes.txt to photo.jpg. */
export function textFile(): Buffer {
  return Buffer.from('Notes from the inspection of the comparable.\nNot an image at all.\n'.repeat(20), 'utf8');
}

/** A file a little over 15 MB that starts like a JPEG (the size limit, not the decoder, must stop it). */
export async function oversizeFile(): Promise<Buffer> {
  const head = await plainJpeg(16, 16);
  return Buffer.concat([head, Buffer.alloc(15 * 1024 * 1024 + 64 * 1024 - head.length, 0x20)]);
}

let bombCache: Promise<Buffer> | undefined;

/** A decompression bomb: a PNG of 20,000 × 20,000 pixels of one grey (400 megapixels) that
 * compresses to a few hundred KB. Made once per test file (it takes several seconds). */
export function pngBomb(): Promise<Buffer> {
  bombCache ??= sharp({ create: { width: 20_000, height: 20_000, channels: 3, background: '#ffffff' }, limitInputPixels: false })
    .toColourspace('b-w')
    .png({ compressionLevel: 9 })
    .toBuffer();
  return bombCache;
}

/** Whether an EXIF block (as sharp's metadata().exif returns it, "Exif\0\0" then TIFF) has a GPS
 * IFD pointer (tag 0x8825) in IFD0. Read independently of the code under test. */
export function exifHasGpsBlock(exif: Buffer): boolean {
  const tiff = exif.subarray(exif.subarray(0, 6).toString('latin1') === 'Exif\0\0' ? 6 : 0);
  const little = tiff.subarray(0, 2).toString('latin1') === 'II';
  const u16 = (at: number) => (little ? tiff.readUInt16LE(at) : tiff.readUInt16BE(at));
  const u32 = (at: number) => (little ? tiff.readUInt32LE(at) : tiff.readUInt32BE(at));
  const ifd0 = u32(4);
  const entries = u16(ifd0);
  for (let i = 0; i < entries; i++) {
    if (u16(ifd0 + 2 + i * 12) === 0x8825) return true;
  }
  return false;
}

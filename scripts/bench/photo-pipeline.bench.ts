// Budget: a 12-megapixel JPEG through the photo pipeline (decode, rotate, strip, two sizes) < 500 ms.
// Baseline in the same run: sharp decoding the same file and re-encoding it once at full size.
import sharp from 'sharp';
import { processPhoto } from '../../server/modules/photos/photo-pipeline';
import { median, recordFigures } from './report';

const width = 4000;
const height = 3000;
// A photo-like image: smooth gradients plus noise, so the JPEG is not trivially compressible.
const raw = Buffer.alloc(width * height * 3);
for (let y = 0; y < height; y++) {
  for (let x = 0; x < width; x++) {
    const i = (y * width + x) * 3;
    const n = (x * 7919 + y * 104729) % 37;
    raw[i] = (x / width) * 200 + n;
    raw[i + 1] = (y / height) * 180 + n;
    raw[i + 2] = 90 + ((x + y) % 60) + n;
  }
}
const jpeg = await sharp(raw, { raw: { width, height, channels: 3 } })
  .withExif({ IFD0: { Orientation: '6', Make: 'Bench' } })
  .jpeg({ quality: 90 })
  .toBuffer();

const timeIt = async (fn: () => Promise<unknown>, runs: number) => {
  const out: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    out.push(performance.now() - t0);
  }
  return median(out);
};
await timeIt(() => processPhoto(jpeg, 'bench.jpg'), 1);
const baseline = await timeIt(() => sharp(jpeg).jpeg({ quality: 82 }).toBuffer(), 5);
const pipeline = await timeIt(() => processPhoto(jpeg, 'bench.jpg'), 7);
console.log(`12 MP JPEG (${(jpeg.length / 1e6).toFixed(1)} MB): pipeline ${pipeline.toFixed(0)} ms (budget < 500 ms); plain decode + re-encode ${baseline.toFixed(0)} ms; ratio ${(pipeline / baseline).toFixed(2)}×`);
recordFigures('photo-pipeline', [
  ['12 MP JPEG through the pipeline (median of 7)', `${pipeline.toFixed(0)} ms (budget < 500 ms)`],
  ['baseline: sharp decode + one full-size re-encode', `${baseline.toFixed(0)} ms`],
  ['ratio', `${(pipeline / baseline).toFixed(2)}×`],
]);

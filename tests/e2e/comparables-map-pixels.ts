import sharp from 'sharp';
import type { Locator, Page } from 'playwright-core';

/** Pixels of an element as the page draws it (the map's WebGL canvas with its HTML markers). */
export interface Pixels {
  width: number;
  height: number;
  channels: number;
  data: Buffer;
}

export async function elementPixels(element: Locator, path?: string): Promise<Pixels> {
  const png = await element.screenshot({ path, animations: 'disabled' });
  const { data, info } = await sharp(png).raw().toBuffer({ resolveWithObject: true });
  return { width: info.width, height: info.height, channels: info.channels, data };
}

export function rgbAt(pixels: Pixels, x: number, y: number): [number, number, number] {
  const i = (Math.round(y) * pixels.width + Math.round(x)) * pixels.channels;
  return [pixels.data[i], pixels.data[i + 1], pixels.data[i + 2]];
}

/** How many distinct colours, and the share of the commonest one. A blank canvas has one colour. */
export function colourSummary(pixels: Pixels): { distinct: number; commonestShare: number } {
  const counts = new Map<number, number>();
  for (let i = 0; i < pixels.data.length; i += pixels.channels) {
    const key = (pixels.data[i] << 16) | (pixels.data[i + 1] << 8) | pixels.data[i + 2];
    counts.set(key, (counts.get(key) ?? 0) + 1);
  }
  const total = pixels.width * pixels.height;
  return { distinct: counts.size, commonestShare: Math.max(...counts.values()) / total };
}

export function shareOf(pixels: Pixels, rgb: [number, number, number], tolerance = 0): number {
  let hits = 0;
  for (let i = 0; i < pixels.data.length; i += pixels.channels) {
    const d = Math.abs(pixels.data[i] - rgb[0]) + Math.abs(pixels.data[i + 1] - rgb[1]) + Math.abs(pixels.data[i + 2] - rgb[2]);
    if (d <= tolerance) hits++;
  }
  return hits / (pixels.width * pixels.height);
}

export const hex = (value: string): [number, number, number] => {
  const n = parseInt(value.replace('#', ''), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
};

/**
 * A spot on open land to click: land-coloured in the screenshot, the canvas itself under the
 * pointer (no marker, label or control), well clear of every marker, and as near the subject as
 * such a spot can be. Page coordinates.
 */
export async function openLandNearSubject(page: Page, map: Locator, pixels: Pixels, land: [number, number, number]): Promise<{ x: number; y: number }> {
  const box = (await map.boundingBox())!;
  const found = await page.evaluate(
    ({ box, candidates }) => {
      const marks = [...document.querySelectorAll('.maplibregl-marker, .maplibregl-popup')].map((m) => m.getBoundingClientRect());
      const subject = document.querySelector('.cm-subject')?.getBoundingClientRect();
      const centre = subject ? { x: subject.x + subject.width / 2, y: subject.y + subject.height / 2 } : { x: box.x + box.width / 2, y: box.y + box.height / 2 };
      const clear = candidates
        .map(([dx, dy]) => ({ x: box.x + dx, y: box.y + dy }))
        .filter((p) => document.elementFromPoint(p.x, p.y)?.tagName === 'CANVAS')
        .filter((p) => marks.every((r) => p.x < r.left - 24 || p.x > r.right + 24 || p.y < r.top - 24 || p.y > r.bottom + 24))
        .sort((a, b) => Math.hypot(a.x - centre.x, a.y - centre.y) - Math.hypot(b.x - centre.x, b.y - centre.y));
      return clear[0] ?? null;
    },
    { box, candidates: landCandidates(pixels, land) },
  );
  if (!found) throw new Error('no open land on the map to click');
  return found;
}

function landCandidates(pixels: Pixels, land: [number, number, number]): Array<[number, number]> {
  const out: Array<[number, number]> = [];
  for (let y = 40; y < pixels.height - 40; y += 10) {
    for (let x = 40; x < pixels.width - 90; x += 10) {
      const [r, g, b] = rgbAt(pixels, x, y);
      if (Math.abs(r - land[0]) + Math.abs(g - land[1]) + Math.abs(b - land[2]) <= 30) out.push([x, y]);
    }
  }
  return out;
}

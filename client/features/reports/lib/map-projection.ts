import { z } from 'zod';

/** The shipped basemap of the demo town (public/basemap/*.geojson), read loosely: only polygons and
 * lines with a name and a kind are drawn. */
const position = z.tuple([z.number(), z.number()]).rest(z.number());
const geometry = z.discriminatedUnion('type', [
  z.object({ type: z.literal('Polygon'), coordinates: z.array(z.array(position)) }),
  z.object({ type: z.literal('LineString'), coordinates: z.array(position) }),
  z.object({ type: z.literal('MultiPolygon'), coordinates: z.array(z.array(z.array(position))) }),
]);
export const basemapLayer = z.object({
  type: z.literal('FeatureCollection'),
  features: z.array(
    z.object({
      type: z.literal('Feature'),
      properties: z.object({ name: z.string().optional(), kind: z.string().optional(), slug: z.string().optional() }).passthrough(),
      geometry,
    }),
  ),
});
export type BasemapLayer = z.infer<typeof basemapLayer>;
export type BasemapFeature = BasemapLayer['features'][number];
type Position = readonly number[];

export interface Projection {
  width: number;
  height: number;
  point: (lon: number, lat: number) => [number, number];
  /** Metres per SVG unit, for the scale bar. */
  metresPerUnit: number;
}

/**
 * A plain equirectangular projection centred on the bounds: at the scale of one town, longitude
 * shrunk by cos(latitude) is true to within a fraction of a percent. The bounds are padded and
 * widened to the drawing's aspect ratio.
 */
export function fitProjection(bounds: [number, number, number, number], width: number, height: number, pad = 0.06): Projection {
  const [w, s, e, n] = bounds;
  const midLat = ((s + n) / 2) * (Math.PI / 180);
  const kx = Math.cos(midLat);
  const spanX = Math.max((e - w) * kx, 1e-6) * (1 + 2 * pad);
  const spanY = Math.max(n - s, 1e-6) * (1 + 2 * pad);
  const scale = Math.min(width / spanX, height / spanY);
  const cx = ((w + e) / 2) * kx;
  const cy = (s + n) / 2;
  const metresPerDegree = 111_320;
  return {
    width,
    height,
    point: (lon, lat) => [width / 2 + (lon * kx - cx) * scale, height / 2 - (lat - cy) * scale],
    metresPerUnit: metresPerDegree / scale,
  };
}

export function pathOf(feature: BasemapFeature, projection: Projection): string {
  const line = (ring: readonly Position[], close: boolean) =>
    ring.map(([lon, lat], i) => `${i === 0 ? 'M' : 'L'}${projection.point(lon, lat).map((v) => v.toFixed(1)).join(' ')}`).join('') + (close ? 'Z' : '');
  const g = feature.geometry;
  if (g.type === 'LineString') return line(g.coordinates, false);
  if (g.type === 'Polygon') return g.coordinates.map((ring) => line(ring, true)).join('');
  return g.coordinates.flatMap((poly) => poly.map((ring) => line(ring, true))).join('');
}

/** The middle of a polygon's outer ring (its vertices' mean: enough to place a label). */
export function labelPoint(feature: BasemapFeature): [number, number] | null {
  const ring = feature.geometry.type === 'Polygon' ? feature.geometry.coordinates[0] : null;
  if (!ring?.length) return null;
  const pts = ring.slice(0, -1);
  return [pts.reduce((a, p) => a + p[0], 0) / pts.length, pts.reduce((a, p) => a + p[1], 0) / pts.length];
}

/** A round length for the scale bar that fits in `maxUnits` of the drawing. */
export function scaleBar(projection: Projection, maxUnits: number): { units: number; label: string } {
  const maxMetres = maxUnits * projection.metresPerUnit;
  const steps = [50, 100, 200, 250, 500, 1000, 2000, 5000, 10_000];
  const metres = [...steps].reverse().find((m) => m <= maxMetres) ?? steps[0];
  const label = metres >= 1000 ? `${new Intl.NumberFormat().format(metres / 1000)} km` : `${new Intl.NumberFormat().format(metres)} m`;
  return { units: metres / projection.metresPerUnit, label };
}

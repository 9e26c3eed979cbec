/**
 * Writes the shipped basemap of Port Ellery (an invented town) to public/basemap/:
 *   coast.geojson          sea, land, the harbour's pier and breakwater, an islet, a quarry pond
 *   streets.geojson        every street of the model, LineStrings with `name` and `kind`
 *   parks.geojson          parks (the woods ring the quarry pond) and the salt-marsh reserve, with `name`
 *   neighbourhoods.geojson the four neighbourhood polygons of the model, with `slug` and `name`
 *
 * Streets and neighbourhoods come from db/seed/port-ellery-model.ts, so the map and the demo sales
 * share one source. The coastline and parks are drawn here, in kilometres from the town centre.
 * Run: npx tsx scripts/make-basemap.ts
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { booleanDisjoint, booleanPointInPolygon, booleanWithin, lineString, point, polygon, rewind } from '@turf/turf';
import type { Feature, LineString, Polygon } from 'geojson';
import { NEIGHBOURHOODS, STREETS, lonLatFromLocalKm, ringFromLocalKm, type LonLat } from '../db/seed/port-ellery-model';

type Km = readonly [number, number];

const outputDir = join(dirname(fileURLToPath(import.meta.url)), '..', 'public', 'basemap');

// Map extent, km from the town centre.
const WEST = -2.6;
const EAST = 2.6;
const SOUTH = -1.3;
const NORTH = 2.0;

/** The shore from the west edge to the east edge, dipping north into the harbour bay. */
const COASTLINE: Km[] = smooth([
  [WEST, -0.8], [-2.3, -0.72], [-2.05, -0.64], [-1.7, -0.72], [-1.45, -0.62], [-1.2, -0.6], [-0.9, -0.66],
  [-0.6, -0.56], [-0.63, -0.32], [-0.6, -0.1], [-0.5, 0.05], [-0.3, 0.12], [0.0, 0.15], [0.3, 0.12], [0.5, 0.04],
  [0.6, -0.12], [0.62, -0.32], [0.6, -0.56], [0.9, -0.68], [1.3, -0.62], [1.7, -0.74], [2.0, -0.66], [2.3, -0.75],
  [EAST, -0.7],
], 2);

/** Chaikin corner cutting: each pass replaces a corner by two points a quarter of the way along its sides. */
function smooth(points: readonly Km[], passes: number): Km[] {
  let current = [...points];
  for (let pass = 0; pass < passes; pass++) {
    const next: Km[] = [current[0]];
    for (let i = 0; i < current.length - 1; i++) {
      const [[ax, ay], [bx, by]] = [current[i], current[i + 1]];
      next.push([0.75 * ax + 0.25 * bx, 0.75 * ay + 0.25 * by], [0.25 * ax + 0.75 * bx, 0.25 * ay + 0.75 * by]);
    }
    next.push(current[current.length - 1]);
    current = next;
  }
  return current;
}

/** A rough circle of `sides` vertices, for small islands and ponds. */
function blob(cx: number, cy: number, radius: number, sides: number, wobble: readonly number[]): Km[] {
  return Array.from({ length: sides }, (_, i) => {
    const angle = (2 * Math.PI * i) / sides;
    const r = radius * (1 + wobble[i % wobble.length]);
    return [cx + r * Math.cos(angle), cy + r * Math.sin(angle)] as const;
  });
}

function area(properties: Record<string, string>, km: readonly Km[], holes: ReadonlyArray<readonly Km[]> = []): Feature<Polygon> {
  return rewind(polygon([km, ...holes].map((ring) => ringFromLocalKm(ring)), properties)) as Feature<Polygon>;
}

function line(properties: Record<string, string>, km: readonly Km[]): Feature<LineString> {
  return lineString(km.map(([x, y]) => lonLatFromLocalKm(x, y)), properties);
}

const QUARRY_POND = blob(-1.22, 1.56, 0.07, 8, [0.1, -0.15, 0.2, 0, -0.1, 0.15, -0.2, 0.05]);
const land = area({ kind: 'land', name: 'Port Ellery' }, [...COASTLINE, [EAST, NORTH], [WEST, NORTH]]);
const coast = [
  area({ kind: 'water', name: 'Ellery Sound' }, [...COASTLINE, [EAST, SOUTH], [WEST, SOUTH]]),
  land,
  area({ kind: 'land', name: 'Gannet Rock' }, blob(-0.25, -1.02, 0.07, 9, [0, 0.2, -0.1, 0.15, -0.2, 0.05, 0.25, -0.05, 0.1])),
  area({ kind: 'water', name: 'Quarry Pond' }, QUARRY_POND),
  line({ kind: 'pier', name: 'Fish Pier' }, [[0.0, 0.15], [0.0, -0.12], [0.05, -0.15]]),
  line({ kind: 'breakwater', name: 'East Breakwater' }, [[0.72, -0.6], [0.55, -0.64], [0.42, -0.67], [0.3, -0.68]]),
];

const parks = [
  area({ kind: 'park', name: 'Harbour Green' }, [[-0.45, 0.31], [-0.08, 0.32], [-0.08, 0.42], [-0.45, 0.41]]),
  area({ kind: 'park', name: 'Net Loft Green' }, [[0.1, 0.32], [0.45, 0.31], [0.45, 0.41], [0.1, 0.42]]),
  area({ kind: 'park', name: 'Quarry Woods' }, [
    [-1.55, 1.4], [-0.85, 1.42], [-0.6, 1.5], [-0.7, 1.66], [-1.2, 1.68], [-1.55, 1.6],
  ], [QUARRY_POND]),
  area({ kind: 'reserve', name: 'Saltmarsh Reserve' }, [
    [-2.4, -0.62], [-2.05, -0.55], [-1.85, -0.62], [-1.7, -0.35], [-1.7, 0.3], [-2.1, 0.35], [-2.4, 0.1],
  ]),
];

const streets = STREETS.map((s) => lineString(s.path, { name: s.name, kind: s.kind }));

const neighbourhoods = NEIGHBOURHOODS.map((n) => polygon([n.polygon], { slug: n.slug, name: n.name }));

/** Stops with a message when the drawing contradicts itself (a neighbourhood in the sea, a park over houses). */
function checkGeometry(): void {
  const problems: string[] = [];
  for (const n of neighbourhoods) {
    if (!booleanWithin(n, land)) problems.push(`${n.properties.name} is not entirely on land`);
    for (const park of parks) {
      if (!booleanDisjoint(n, park)) problems.push(`${park.properties?.name} overlaps ${n.properties.name}`);
    }
  }
  for (const s of streets) {
    const offshore = s.geometry.coordinates.filter((c) => !booleanPointInPolygon(point(c as LonLat), land));
    if (offshore.length > 0) problems.push(`${s.properties.name} has ${offshore.length} vertices in the sea`);
  }
  if (problems.length > 0) throw new Error(`basemap geometry problems:\n  ${problems.join('\n  ')}`);
}

/** One feature per line: small files that still read well in a diff. */
function writeCollection(fileName: string, features: readonly Feature[]): number {
  const body = `{"type":"FeatureCollection","features":[\n${features.map((f) => JSON.stringify(f)).join(',\n')}\n]}\n`;
  writeFileSync(join(outputDir, fileName), body);
  return body.length;
}

checkGeometry();
mkdirSync(outputDir, { recursive: true });
const sizes = {
  'coast.geojson': writeCollection('coast.geojson', coast),
  'streets.geojson': writeCollection('streets.geojson', streets),
  'parks.geojson': writeCollection('parks.geojson', parks),
  'neighbourhoods.geojson': writeCollection('neighbourhoods.geojson', neighbourhoods),
};
for (const [file, bytes] of Object.entries(sizes)) console.log(`public/basemap/${file}  ${(bytes / 1024).toFixed(1)} KB`);

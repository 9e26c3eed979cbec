import { readFileSync } from 'node:fs';
import path from 'node:path';
import { booleanPointInPolygon } from '@turf/turf';
import type { Feature, FeatureCollection, MultiPolygon, Polygon } from 'geojson';

type Boundary = Feature<Polygon | MultiPolygon, { name: string }>;
let boundaries: Boundary[] | null = null;

/** The neighbourhood boundaries shipped with the basemap (public/basemap/neighbourhoods.geojson). */
function loadBoundaries(): Boundary[] {
  if (!boundaries) {
    const file = path.resolve(import.meta.dirname, '../../../public/basemap/neighbourhoods.geojson');
    const collection = JSON.parse(readFileSync(file, 'utf8')) as FeatureCollection<Polygon | MultiPolygon, { name: string }>;
    boundaries = collection.features;
  }
  return boundaries;
}

/** The name of the neighbourhood containing the point, or null outside every boundary. */
export function neighbourhoodAt(lon: number, lat: number): string | null {
  const hit = loadBoundaries().find((f) => booleanPointInPolygon([lon, lat], f));
  return hit ? hit.properties.name : null;
}

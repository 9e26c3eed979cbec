import { booleanPointInPolygon } from '@turf/turf';
import type { FeatureCollection, MultiPolygon, Polygon } from 'geojson';

export type NeighbourhoodBoundaries = FeatureCollection<Polygon | MultiPolygon, { name?: string }>;

/** The name of the shipped neighbourhood boundary that holds the point; null outside them all.
 * The server runs the same test on the same file when a location comes without a neighbourhood. */
export function neighbourhoodAt(boundaries: NeighbourhoodBoundaries, lon: number, lat: number): string | null {
  const hit = boundaries.features.find((feature) => booleanPointInPolygon([lon, lat], feature));
  return hit?.properties?.name ?? null;
}

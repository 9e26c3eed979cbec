import { bbox, circle, destination, featureCollection, point } from '@turf/turf';
import type { Feature, FeatureCollection, Polygon } from 'geojson';
import type { LonLat } from '../map-types';

/** Distance rings around the subject: ½ and 1 mile for square-foot assignments, 1 and 2 km for
 * square-metre ones. */
export function ringRadii(areaUnit: 'sqft' | 'sqm'): { radii: readonly number[]; units: 'miles' | 'kilometers' } {
  return areaUnit === 'sqft' ? { radii: [0.5, 1], units: 'miles' } : { radii: [1, 2], units: 'kilometers' };
}

export function ringPolygons(subject: LonLat, areaUnit: 'sqft' | 'sqm'): FeatureCollection<Polygon> {
  const { radii, units } = ringRadii(areaUnit);
  const rings: Feature<Polygon>[] = radii.map((radius) => circle([subject.lon, subject.lat], radius, { units, steps: 128, properties: { radius } }));
  return featureCollection(rings);
}

/** Where each ring's label sits: on the ring, up and to the right of the subject. */
export function ringLabelPoints(subject: LonLat, areaUnit: 'sqft' | 'sqm'): Array<{ radius: number; at: [number, number] }> {
  const { radii, units } = ringRadii(areaUnit);
  return radii.map((radius) => ({ radius, at: destination(point([subject.lon, subject.lat]), radius, 38, { units }).geometry.coordinates as [number, number] }));
}

/** [west, south, east, north] around the outer ring. */
export function outerRingBounds(subject: LonLat, areaUnit: 'sqft' | 'sqm'): [number, number, number, number] {
  const rings = ringPolygons(subject, areaUnit);
  return bbox(rings.features[rings.features.length - 1]) as [number, number, number, number];
}

export function ringLabelText(radius: number, areaUnit: 'sqft' | 'sqm'): string {
  return new Intl.NumberFormat(undefined, { style: 'unit', unit: areaUnit === 'sqft' ? 'mile' : 'kilometer', unitDisplay: 'short', maximumFractionDigits: 1 }).format(radius);
}

import type { MapOptions } from 'maplibre-gl';
import type { MapColours } from './map-colours';

export type StyleSpecification = Exclude<MapOptions['style'], string | undefined>;

/** The shipped Port Ellery basemap (public/basemap), used unless the installation sets a self-hosted
 * vector style (MAP_STYLE_URL, read through GET /api/config). It needs no network. */
const BASEMAP = '/basemap';

/** The extent of the shipped basemap, [west, south, east, north]. */
export const TOWN_BOUNDS: [number, number, number, number] = [-61.4329, 44.6882, -61.3671, 44.7181];

type Bounds = [number, number, number, number];

/** The part of `bounds` inside the town, or the town when they do not meet. */
export function withinTown(bounds: Bounds): Bounds {
  const [w, s, e, n] = TOWN_BOUNDS;
  const clipped: Bounds = [Math.max(bounds[0], w), Math.max(bounds[1], s), Math.min(bounds[2], e), Math.min(bounds[3], n)];
  return clipped[0] < clipped[2] && clipped[1] < clipped[3] ? clipped : TOWN_BOUNDS;
}

/** How far the view may wander: the town and a margin around it. */
export function panLimits(): Bounds {
  const [w, s, e, n] = TOWN_BOUNDS;
  const dx = (e - w) * 0.45;
  const dy = (n - s) * 0.45;
  return [w - dx, s - dy, e + dx, n + dy];
}

/** Land, water, parks, streets and neighbourhood boundaries in Compline's colours. No symbol or text
 * layers: no glyphs are shipped, so names are drawn as HTML labels instead. */
export function basemapStyle(c: MapColours): StyleSpecification {
  const kind = (value: string) => ['==', ['get', 'kind'], value] as ['==', ['get', string], string];
  return {
    version: 8,
    sources: {
      coast: { type: 'geojson', data: `${BASEMAP}/coast.geojson` },
      parks: { type: 'geojson', data: `${BASEMAP}/parks.geojson` },
      streets: { type: 'geojson', data: `${BASEMAP}/streets.geojson` },
      neighbourhoods: { type: 'geojson', data: `${BASEMAP}/neighbourhoods.geojson` },
    },
    layers: [
      { id: 'outside', type: 'background', paint: { 'background-color': c.outside } },
      { id: 'sea', type: 'fill', source: 'coast', filter: kind('water'), paint: { 'fill-color': c.water } },
      { id: 'land', type: 'fill', source: 'coast', filter: kind('land'), paint: { 'fill-color': c.paper } },
      { id: 'shoreline', type: 'line', source: 'coast', filter: kind('land'), paint: { 'line-color': c.shore, 'line-width': 1.1, 'line-opacity': 0.55 } },
      {
        id: 'pond',
        type: 'fill',
        source: 'coast',
        filter: ['all', kind('water'), ['==', ['get', 'name'], 'Quarry Pond']],
        paint: { 'fill-color': c.water, 'fill-outline-color': c.shore },
      },
      {
        id: 'parks',
        type: 'fill',
        source: 'parks',
        paint: { 'fill-color': c['teal-wash'], 'fill-opacity': ['match', ['get', 'kind'], 'reserve', 0.7, 0.95] },
      },
      { id: 'parks-edge', type: 'line', source: 'parks', paint: { 'line-color': c.teal, 'line-opacity': 0.28, 'line-width': 1 } },
      {
        id: 'quays',
        type: 'line',
        source: 'coast',
        filter: ['==', ['geometry-type'], 'LineString'],
        paint: { 'line-color': c['rule-strong'], 'line-width': ['interpolate', ['linear'], ['zoom'], 13, 2, 17, 7] },
        layout: { 'line-cap': 'butt' },
      },
      {
        id: 'street-casing',
        type: 'line',
        source: 'streets',
        paint: {
          'line-color': ['match', ['get', 'kind'], 'main', c.shore, c['rule-strong']],
          'line-width': ['interpolate', ['exponential', 1.5], ['zoom'], 12, ['match', ['get', 'kind'], 'main', 3.2, 1.8], 17, ['match', ['get', 'kind'], 'main', 17, 12]],
        },
        layout: { 'line-cap': 'round', 'line-join': 'round' },
      },
      {
        id: 'street',
        type: 'line',
        source: 'streets',
        paint: {
          'line-color': c['paper-raised'],
          'line-width': ['interpolate', ['exponential', 1.5], ['zoom'], 12, ['match', ['get', 'kind'], 'main', 1.8, 0.9], 17, ['match', ['get', 'kind'], 'main', 14, 9.5]],
        },
        layout: { 'line-cap': 'round', 'line-join': 'round' },
      },
      {
        id: 'neighbourhood-lines',
        type: 'line',
        source: 'neighbourhoods',
        paint: { 'line-color': c['ink-soft'], 'line-width': 1.4, 'line-opacity': 0.75, 'line-dasharray': [3, 2.2] },
      },
    ],
  };
}

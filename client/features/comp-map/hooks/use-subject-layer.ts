import { useEffect, useRef } from 'react';
import * as maplibregl from 'maplibre-gl';
import type { GeoJSONSource } from 'maplibre-gl';
import type { LonLat } from '../map-types';
import type { MapColours } from '../lib/map-colours';
import { labelElement, subjectMarkerElement } from '../lib/marker-elements';
import { ringLabelPoints, ringLabelText, ringPolygons } from '../lib/rings';

const RINGS = 'subject-rings';
const EMPTY = { type: 'FeatureCollection' as const, features: [] };

/** The subject's marker and its distance rings with their labels. */
export function useSubjectLayer(map: maplibregl.Map | null, colours: MapColours | null, subject: LonLat | null, areaUnit: 'sqft' | 'sqm') {
  const subjectMarker = useRef<maplibregl.Marker | null>(null);
  const ringLabels = useRef<maplibregl.Marker[]>([]);

  // The ring layers, once per map (below the sales, above the basemap).
  useEffect(() => {
    if (!map || !colours) return;
    map.addSource(RINGS, { type: 'geojson', data: EMPTY });
    map.addLayer({ id: 'subject-ring-wash', type: 'fill', source: RINGS, paint: { 'fill-color': colours.ink, 'fill-opacity': 0.025 } });
    map.addLayer({
      id: 'subject-rings',
      type: 'line',
      source: RINGS,
      paint: { 'line-color': colours.ink, 'line-width': 1.3, 'line-opacity': 0.6, 'line-dasharray': [1.2, 1.6] },
    });
    return () => {
      if (!map.getStyle()) return;
      for (const id of ['subject-rings', 'subject-ring-wash']) if (map.getLayer(id)) map.removeLayer(id);
      if (map.getSource(RINGS)) map.removeSource(RINGS);
    };
  }, [map, colours]);

  useEffect(() => {
    if (!map) return;
    const source = map.getSource<GeoJSONSource>(RINGS);
    source?.setData(subject ? ringPolygons(subject, areaUnit) : EMPTY);

    for (const label of ringLabels.current) label.remove();
    ringLabels.current = subject
      ? ringLabelPoints(subject, areaUnit).map(({ radius, at }) =>
          new maplibregl.Marker({ element: labelElement(ringLabelText(radius, areaUnit), 'cm-ring-label') }).setLngLat(at).addTo(map),
        )
      : [];

    if (!subject) {
      subjectMarker.current?.remove();
      subjectMarker.current = null;
      return;
    }
    if (!subjectMarker.current) {
      subjectMarker.current = new maplibregl.Marker({ element: subjectMarkerElement(), anchor: 'bottom', offset: [0, 4] });
      subjectMarker.current.setLngLat([subject.lon, subject.lat]).addTo(map);
    } else {
      subjectMarker.current.setLngLat([subject.lon, subject.lat]);
    }
  }, [map, subject?.lon, subject?.lat, areaUnit]); // eslint-disable-line react-hooks/exhaustive-deps

  useEffect(
    () => () => {
      subjectMarker.current?.remove();
      subjectMarker.current = null;
      for (const label of ringLabels.current) label.remove();
      ringLabels.current = [];
    },
    [map],
  );
}

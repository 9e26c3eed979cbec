import { useEffect } from 'react';
import * as maplibregl from 'maplibre-gl';
import { centerOfMass } from '@turf/turf';
import type { FeatureCollection, MultiPolygon, Polygon } from 'geojson';
import { labelElement } from '../lib/marker-elements';

/** Neighbourhood names as quiet HTML labels at each boundary's centre (no glyphs ship with the map). */
export function useAreaLabels(map: maplibregl.Map | null) {
  useEffect(() => {
    if (!map) return;
    const controller = new AbortController();
    const labels: maplibregl.Marker[] = [];
    fetch('/basemap/neighbourhoods.geojson', { signal: controller.signal })
      .then((response) => (response.ok ? (response.json() as Promise<FeatureCollection<Polygon | MultiPolygon, { name?: string }>>) : null))
      .then((collection) => {
        for (const feature of collection?.features ?? []) {
          if (!feature.properties?.name) continue;
          const at = centerOfMass(feature).geometry.coordinates as [number, number];
          labels.push(new maplibregl.Marker({ element: labelElement(feature.properties.name, 'cm-area-label') }).setLngLat(at).addTo(map));
        }
      })
      .catch(() => {
        // Names are a courtesy: the boundaries are still drawn when this file cannot be read.
      });
    return () => {
      controller.abort();
      for (const label of labels) label.remove();
    };
  }, [map]);
}

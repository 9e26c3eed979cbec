import { useEffect, useRef } from 'react';
import * as maplibregl from 'maplibre-gl';
import type { GeoJSONSource } from 'maplibre-gl';
import type { ExpressionSpecification } from '@maplibre/maplibre-gl-style-spec';
import type { FeatureCollection, Point } from 'geojson';
import type { MapSale } from '../map-types';
import { bandColour, residualBands, type MapColours } from '../lib/map-colours';
import { labelElement } from '../lib/marker-elements';

const SOURCE = 'sales';
const LAYERS = ['sale-clusters', 'sale-points', 'sale-selected'] as const;
const MAX_COUNT_LABELS = 250;

function toFeatures(sales: readonly MapSale[]): FeatureCollection<Point> {
  return {
    type: 'FeatureCollection',
    features: sales.map((s) => ({
      type: 'Feature',
      geometry: { type: 'Point', coordinates: [s.lon, s.lat] },
      properties: { id: s.id, band: s.band, flagged: s.flagged, excluded: s.excluded, inGrid: s.inGrid },
    })),
  };
}

const flag = (name: string): ExpressionSpecification => ['boolean', ['get', name], false];

/**
 * Many sales (thousands) as one clustered GeoJSON source drawn by circle layers on the GPU. Single
 * sales keep their residual colour through a data-driven paint property; clusters are ink discs
 * sized by count, with the count as an HTML label. A click on a cluster zooms into it.
 */
export function useSaleClusters(map: maplibregl.Map | null, colours: MapColours | null, sales: readonly MapSale[], selectedId: number | null, enabled: boolean, onSelect: (id: number) => void) {
  const latestSelect = useRef(onSelect);
  latestSelect.current = onSelect;

  useEffect(() => {
    if (!map || !colours || !enabled) return;
    map.addSource(SOURCE, { type: 'geojson', data: toFeatures([]), cluster: true, clusterRadius: 42, clusterMaxZoom: 16 });
    // ['match', band, 'low-strong', colour, …, fallback]: the spread is beyond the spec type's reach.
    const bandPaint = ['match', ['get', 'band'], ...residualBands.flatMap((b) => [b, bandColour(colours, b)]), colours['ink-faint']] as unknown as ExpressionSpecification;
    map.addLayer({
      id: 'sale-clusters',
      type: 'circle',
      source: SOURCE,
      filter: ['has', 'point_count'],
      paint: {
        'circle-color': colours['ink-soft'],
        'circle-opacity': 0.88,
        'circle-radius': ['step', ['get', 'point_count'], 12, 25, 15, 100, 19, 500, 24, 2000, 29],
        'circle-stroke-color': colours['paper-raised'],
        'circle-stroke-width': 2,
      },
    });
    map.addLayer({
      id: 'sale-points',
      type: 'circle',
      source: SOURCE,
      filter: ['!', ['has', 'point_count']],
      paint: {
        'circle-color': ['case', flag('excluded'), colours['paper-raised'], bandPaint],
        'circle-radius': ['interpolate', ['linear'], ['zoom'], 12, 3.5, 15, 5.5, 18, 8],
        'circle-stroke-color': ['case', flag('flagged'), colours['flag-ring'], flag('inGrid'), colours.ink, flag('excluded'), colours['ink-soft'], colours['paper-raised']],
        'circle-stroke-width': ['case', ['any', flag('flagged'), flag('inGrid'), flag('excluded')], 2.2, 1.2],
      },
    });
    map.addLayer({
      id: 'sale-selected',
      type: 'circle',
      source: SOURCE,
      filter: ['==', ['get', 'id'], -1],
      paint: { 'circle-radius': 11, 'circle-color': 'rgba(0,0,0,0)', 'circle-stroke-color': colours.ink, 'circle-stroke-width': 2.5 },
    });

    const clickCluster = async (event: maplibregl.MapLayerMouseEvent) => {
      const feature = event.features?.[0];
      const clusterId = feature?.properties?.cluster_id as number | undefined;
      if (clusterId === undefined || feature?.geometry.type !== 'Point') return;
      const zoom = await map.getSource<GeoJSONSource>(SOURCE)!.getClusterExpansionZoom(clusterId);
      map.easeTo({ center: feature.geometry.coordinates as [number, number], zoom });
    };
    const clickPoint = (event: maplibregl.MapLayerMouseEvent) => {
      const id = event.features?.[0]?.properties?.id as number | undefined;
      if (id !== undefined) latestSelect.current(id);
    };
    const pointer = () => (map.getCanvas().style.cursor = 'pointer');
    const noPointer = () => (map.getCanvas().style.cursor = '');
    map.on('click', 'sale-clusters', clickCluster);
    map.on('click', 'sale-points', clickPoint);
    for (const layer of ['sale-clusters', 'sale-points'] as const) {
      map.on('mouseenter', layer, pointer);
      map.on('mouseleave', layer, noPointer);
    }

    // Cluster counts as HTML labels, refreshed when the view or the data settles.
    const labels = new Map<number, maplibregl.Marker>();
    const refreshLabels = () => {
      const seen = new Set<number>();
      for (const feature of map.querySourceFeatures(SOURCE, { filter: ['has', 'point_count'] })) {
        const id = feature.properties?.cluster_id as number;
        if (seen.has(id) || seen.size >= MAX_COUNT_LABELS || feature.geometry.type !== 'Point') continue;
        seen.add(id);
        const at = feature.geometry.coordinates as [number, number];
        const text = String(feature.properties?.point_count_abbreviated ?? feature.properties?.point_count);
        const existing = labels.get(id);
        if (existing) existing.setLngLat(at).getElement().textContent = text;
        else labels.set(id, new maplibregl.Marker({ element: labelElement(text, 'cm-cluster-label') }).setLngLat(at).addTo(map));
      }
      for (const [id, label] of labels) {
        if (seen.has(id)) continue;
        label.remove();
        labels.delete(id);
      }
    };
    const onSourceData = (event: maplibregl.MapSourceDataEvent) => {
      if (event.sourceId === SOURCE && event.isSourceLoaded) refreshLabels();
    };
    map.on('moveend', refreshLabels);
    map.on('sourcedata', onSourceData);

    return () => {
      map.off('moveend', refreshLabels);
      map.off('sourcedata', onSourceData);
      map.off('click', 'sale-clusters', clickCluster);
      map.off('click', 'sale-points', clickPoint);
      for (const label of labels.values()) label.remove();
      if (!map.getStyle()) return;
      for (const layer of LAYERS) if (map.getLayer(layer)) map.removeLayer(layer);
      if (map.getSource(SOURCE)) map.removeSource(SOURCE);
    };
  }, [map, colours, enabled]);

  useEffect(() => {
    if (!map || !enabled) return;
    map.getSource<GeoJSONSource>(SOURCE)?.setData(toFeatures(sales));
  }, [map, sales, enabled]);

  useEffect(() => {
    if (!map || !enabled || !map.getLayer('sale-selected')) return;
    map.setFilter('sale-selected', ['==', ['get', 'id'], selectedId ?? -1]);
  }, [map, selectedId, enabled]);
}

/** The layers that answer a click themselves (the empty-map click handler leaves them alone). */
export const saleLayerIds: readonly string[] = ['sale-clusters', 'sale-points'];

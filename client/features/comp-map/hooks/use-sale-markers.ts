import { useEffect, useRef } from 'react';
import * as maplibregl from 'maplibre-gl';
import type { LonLat, MapSale } from '../map-types';
import { saleMarkerElement, updateSaleMarker } from '../lib/marker-elements';

export interface SaleMarkerCallbacks {
  onSelect: (saleId: number) => void;
  onMove?: (saleId: number, at: LonLat) => void;
}

interface Entry {
  marker: maplibregl.Marker;
  element: HTMLButtonElement;
  sale: MapSale;
}

/** A click that ends a drag is not a selection. */
const CLICK_AFTER_DRAG_MS = 250;

/**
 * One HTML marker per sale (used up to a few hundred sales): real buttons, keyboard reachable,
 * draggable when the caller can move sales. Markers are kept and updated in place, so a change to
 * one sale does not rebuild the others.
 */
export function useSaleMarkers(map: maplibregl.Map | null, sales: readonly MapSale[], selectedId: number | null, enabled: boolean, callbacks: SaleMarkerCallbacks) {
  const entries = useRef(new Map<number, Entry>());
  const latest = useRef(callbacks);
  latest.current = callbacks;
  const draggable = Boolean(callbacks.onMove);

  useEffect(() => {
    const current = entries.current;
    if (!map || !enabled) {
      for (const entry of current.values()) entry.marker.remove();
      current.clear();
      return;
    }
    const seen = new Set<number>();
    for (const sale of sales) {
      seen.add(sale.id);
      const existing = current.get(sale.id);
      if (existing) {
        existing.sale = sale;
        if (existing.marker.isDraggable() !== draggable) existing.marker.setDraggable(draggable);
        const at = existing.marker.getLngLat();
        if (at.lng !== sale.lon || at.lat !== sale.lat) existing.marker.setLngLat([sale.lon, sale.lat]);
        updateSaleMarker(existing.element, sale, sale.id === selectedId);
        continue;
      }
      current.set(sale.id, createEntry(map, sale, sale.id === selectedId, draggable, latest));
    }
    for (const [id, entry] of current) {
      if (seen.has(id)) continue;
      entry.marker.remove();
      current.delete(id);
    }
  }, [map, sales, selectedId, enabled, draggable]);

  useEffect(
    () => () => {
      for (const entry of entries.current.values()) entry.marker.remove();
      entries.current.clear();
    },
    [map],
  );
}

function createEntry(map: maplibregl.Map, sale: MapSale, selected: boolean, draggable: boolean, latest: { current: SaleMarkerCallbacks }): Entry {
  const element = saleMarkerElement(sale);
  updateSaleMarker(element, sale, selected);
  const marker = new maplibregl.Marker({ element, draggable, anchor: 'center' }).setLngLat([sale.lon, sale.lat]).addTo(map);
  const entry: Entry = { marker, element, sale };
  let lastDragEnd = 0;
  element.addEventListener('click', (event) => {
    event.stopPropagation();
    if (Date.now() - lastDragEnd < CLICK_AFTER_DRAG_MS) return;
    latest.current.onSelect(entry.sale.id);
  });
  marker.on('dragend', () => {
    lastDragEnd = Date.now();
    const { lng, lat } = marker.getLngLat();
    if (lng === entry.sale.lon && lat === entry.sale.lat) return;
    latest.current.onMove?.(entry.sale.id, { lon: round6(lng), lat: round6(lat) });
  });
  return entry;
}

/** Six decimals of a degree is about 0.1 m: plenty for a house, and what the demo data carries. */
export function round6(value: number): number {
  return Math.round(value * 1e6) / 1e6;
}

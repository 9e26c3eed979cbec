import { useEffect, useRef } from 'react';
import * as maplibregl from 'maplibre-gl';
import type { LonLat, MapSale, SalePopup } from '../map-types';
import { offerPopupContent, salePopupContent, type PopupActions } from '../lib/marker-elements';
import { round6 } from './use-sale-markers';

export interface PopupCallbacks {
  onClose: () => void;
  onEditSale?: (saleId: number) => void;
  onAddSaleAt?: (at: LonLat) => void;
  onPickLocation?: (at: LonLat) => void;
  describeSale?: (saleId: number) => SalePopup | null;
}

const degrees = new Intl.NumberFormat(undefined, { minimumFractionDigits: 5, maximumFractionDigits: 5 });

export function formatLonLat({ lon, lat }: LonLat): string {
  return `${degrees.format(Math.abs(lat))}° ${lat >= 0 ? 'N' : 'S'}, ${degrees.format(Math.abs(lon))}° ${lon >= 0 ? 'E' : 'W'}`;
}

/**
 * The selected sale's popup, and what a click on empty map does: set a location at once (the
 * subject step) or offer "Add a sale here" (the comparables step). Clicks on markers, popups and
 * the sale layers are theirs, not the empty map's.
 */
export function useMapPopups(map: maplibregl.Map | null, selected: MapSale | null, clickableLayers: readonly string[], callbacks: PopupCallbacks) {
  const latest = useRef(callbacks);
  latest.current = callbacks;
  const salePopup = useRef<{ popup: maplibregl.Popup; saleId: number; quiet: boolean } | null>(null);
  const offerPopup = useRef<maplibregl.Popup | null>(null);

  useEffect(() => {
    if (!map) return;
    const removeSalePopup = () => {
      if (!salePopup.current) return;
      salePopup.current.quiet = true;
      salePopup.current.popup.remove();
      salePopup.current = null;
    };
    if (!selected) {
      removeSalePopup();
      return;
    }
    const actions: PopupActions[] = latest.current.onEditSale ? [{ label: 'Edit sale', onChoose: () => latest.current.onEditSale?.(selected.id) }] : [];
    const content = salePopupContent(selected, latest.current.describeSale?.(selected.id) ?? null, actions);
    if (salePopup.current?.saleId === selected.id) {
      salePopup.current.popup.setLngLat([selected.lon, selected.lat]).setDOMContent(content);
      return;
    }
    removeSalePopup();
    offerPopup.current?.remove();
    const popup = new maplibregl.Popup({ offset: 16, maxWidth: '260px', focusAfterOpen: false, closeOnClick: false });
    const entry = { popup, saleId: selected.id, quiet: false };
    popup.on('close', () => {
      if (!entry.quiet) latest.current.onClose();
      if (salePopup.current === entry) salePopup.current = null;
    });
    popup.setLngLat([selected.lon, selected.lat]).setDOMContent(content).addTo(map);
    salePopup.current = entry;
    if (!map.getBounds().contains([selected.lon, selected.lat])) map.easeTo({ center: [selected.lon, selected.lat] });
  }, [map, selected]);

  useEffect(() => {
    if (!map) return;
    const onClick = (event: maplibregl.MapMouseEvent) => {
      const target = event.originalEvent.target as Element | null;
      if (target?.closest('.maplibregl-marker, .maplibregl-popup')) return;
      const layers = clickableLayers.filter((id) => map.getLayer(id));
      if (layers.length > 0 && map.queryRenderedFeatures(event.point, { layers }).length > 0) return;
      const at = { lon: round6(event.lngLat.lng), lat: round6(event.lngLat.lat) };
      offerPopup.current?.remove();
      offerPopup.current = null;
      if (latest.current.onPickLocation) {
        latest.current.onPickLocation(at);
        return;
      }
      if (salePopup.current) {
        salePopup.current.popup.remove();
        return;
      }
      const addAt = latest.current.onAddSaleAt;
      if (!addAt) return;
      const popup = new maplibregl.Popup({ offset: 6, maxWidth: '240px', focusAfterOpen: true, className: 'cm-offer' });
      const choose = () => {
        popup.remove();
        addAt(at);
      };
      popup.setLngLat([at.lon, at.lat]).setDOMContent(offerPopupContent(formatLonLat(at), [{ label: 'Add a sale here', onChoose: choose, primary: true }])).addTo(map);
      offerPopup.current = popup;
    };
    map.on('click', onClick);
    return () => {
      map.off('click', onClick);
      offerPopup.current?.remove();
      if (salePopup.current) salePopup.current.quiet = true;
      salePopup.current?.popup.remove();
      salePopup.current = null;
    };
  }, [map, clickableLayers]);
}

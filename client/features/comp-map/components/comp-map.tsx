import 'maplibre-gl/dist/maplibre-gl.css';
import '../comp-map.css';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import { configQueries } from '../api/config-queries';
import { CLUSTER_ABOVE, type CompMapProps } from '../map-types';
import { useAreaLabels } from '../hooks/use-area-labels';
import { useMaplibre } from '../hooks/use-maplibre';
import { useMapPopups } from '../hooks/use-map-popups';
import { saleLayerIds, useSaleClusters } from '../hooks/use-sale-clusters';
import { useSaleMarkers } from '../hooks/use-sale-markers';
import { useSubjectLayer } from '../hooks/use-subject-layer';
import { TOWN_BOUNDS, withinTown } from '../lib/basemap-style';
import { outerRingBounds } from '../lib/rings';
import { MapControls } from './map-controls';

const NO_LAYERS: readonly string[] = [];

/**
 * The maplibre map of Port Ellery: basemap, subject with distance rings, sales coloured by
 * residual (HTML markers up to CLUSTER_ABOVE sales, clustered GPU circles beyond). Once the first
 * frame with the sales has settled, the frame carries data-map-ready="true" (browser tests wait on it).
 */
export function CompMapCanvas(props: CompMapProps) {
  const { areaUnit, subject, sales, selectedSaleId = null, onSelectSale, onMoveSale, onEditSale, onAddSaleAt, onPickLocation, describeSale, label, className = '' } = props;
  const containerRef = useRef<HTMLDivElement>(null);
  // The first view frames the subject's outer ring (as far as the town goes), or the whole town.
  const [initialBounds] = useState(() => (subject ? withinTown(outerRingBounds(subject, areaUnit)) : TOWN_BOUNDS));
  const config = useQuery(configQueries.installation());
  // An unreachable config falls back to the shipped basemap rather than leaving the map blank.
  const styleUrl = config.isPending ? undefined : (config.data?.mapStyleUrl ?? null);
  const { map, colours, failure } = useMaplibre(containerRef, initialBounds, styleUrl);
  const clustered = sales.length > CLUSTER_ABOVE;
  const selected = useMemo(() => sales.find((s) => s.id === selectedSaleId) ?? null, [sales, selectedSaleId]);
  // Clustered, only the selected sale gets an HTML marker (so that it can still be dragged).
  const markerSales = useMemo(() => (clustered ? (selected ? [selected] : []) : sales), [clustered, selected, sales]);

  useAreaLabels(map);
  useSubjectLayer(map, colours, subject, areaUnit);
  useSaleClusters(map, colours, sales, selectedSaleId, clustered, (id) => onSelectSale?.(id));
  useSaleMarkers(map, markerSales, selectedSaleId, true, { onSelect: (id) => onSelectSale?.(id), onMove: onMoveSale });
  useMapPopups(map, selected, clustered ? saleLayerIds : NO_LAYERS, {
    onClose: () => onSelectSale?.(null),
    onEditSale,
    onAddSaleAt,
    onPickLocation,
    describeSale,
  });

  const [ready, setReady] = useState(false);
  useEffect(() => {
    if (!map) return;
    let live = true;
    map.once('idle', () => live && setReady(true));
    map.triggerRepaint();
    return () => {
      live = false;
    };
  }, [map]);

  return (
    <div
      role="region"
      aria-label={label}
      data-map-ready={ready ? 'true' : 'false'}
      data-clustered={clustered ? 'true' : 'false'}
      className={`relative isolate overflow-hidden rounded-lg border border-rule-strong bg-paper-sunk ${className}`}
    >
      <div ref={containerRef} className="cm-canvas h-full w-full" data-mode={onPickLocation ? 'pick' : 'browse'} />
      {map && <MapControls map={map} subject={subject} sales={sales} areaUnit={areaUnit} />}
      {failure && (
        <div role="alert" className="absolute inset-x-3 bottom-3 z-10 rounded-md border border-rust/35 bg-rust-wash px-4 py-2.5 text-sm text-ink">
          <span className="font-semibold">The map could not be drawn.</span> <span className="text-ink-soft">{failure}</span>
        </div>
      )}
    </div>
  );
}

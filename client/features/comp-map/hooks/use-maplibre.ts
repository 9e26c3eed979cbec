import { useEffect, useState, type RefObject } from 'react';
import * as maplibregl from 'maplibre-gl';
import workerUrl from 'maplibre-gl/dist/maplibre-gl-worker.mjs?url';
import { basemapStyle, panLimits } from '../lib/basemap-style';
import { readMapColours, type MapColours } from '../lib/map-colours';

// The bundled worker lives at its own hashed URL; without this the map stops on "Worker failed to load".
maplibregl.setWorkerUrl(workerUrl);

export interface MapHandle {
  map: maplibregl.Map | null;
  colours: MapColours | null;
  /** Why the map could not start (no WebGL, the basemap missing); null while all is well. */
  failure: string | null;
}

/** Creates the map once in the container and removes it when the component goes. `map` is set
 * after the style has loaded, so every layer added by the caller lands on a complete style.
 * `styleUrl`: the installation's self-hosted style (MAP_STYLE_URL), null for the shipped basemap,
 * undefined while it is not known yet (the map waits). */
export function useMaplibre(containerRef: RefObject<HTMLDivElement | null>, initialBounds: [number, number, number, number], styleUrl: string | null | undefined): MapHandle {
  const [handle, setHandle] = useState<MapHandle>({ map: null, colours: null, failure: null });

  useEffect(() => {
    const container = containerRef.current;
    if (!container || styleUrl === undefined) return;
    const colours = readMapColours(container);
    let map: maplibregl.Map;
    try {
      map = new maplibregl.Map({
        container,
        style: styleUrl ?? basemapStyle(colours),
        bounds: initialBounds,
        fitBoundsOptions: { padding: 28 },
        maxBounds: panLimits(),
        attributionControl: false,
        dragRotate: false,
        pitchWithRotate: false,
        maxPitch: 0,
        minZoom: 11,
        maxZoom: 19,
        cooperativeGestures: false,
      });
    } catch (error) {
      setHandle({ map: null, colours: null, failure: error instanceof Error ? error.message : 'The map could not start.' });
      return;
    }
    map.touchZoomRotate.disableRotation();
    map.keyboard.disableRotation();
    // Handled here so that maplibre does not print them; the first one is shown beside the map.
    map.on('error', (event) => {
      const message = event.error?.message ?? 'The map stopped on an error.';
      setHandle((current) => (current.failure ? current : { ...current, failure: message }));
    });
    map.once('load', () => {
      hatchOutsideTheTown(map, colours);
      setHandle({ map, colours, failure: null });
    });
    return () => {
      setHandle({ map: null, colours: null, failure: null });
      map.remove();
    };
    // The map is made once the style is known; later bounds are set by the controls, not by
    // re-creating it.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [styleUrl]);

  return handle;
}

/** Beyond the surveyed town the ground is hatched, as on a printed plan, so that the basemap's
 * straight outer edges read as "not mapped" rather than as a coastline. */
function hatchOutsideTheTown(map: maplibregl.Map, colours: MapColours) {
  const size = 10;
  const canvas = document.createElement('canvas');
  canvas.width = size;
  canvas.height = size;
  const context = canvas.getContext('2d');
  if (!context) return;
  context.fillStyle = colours['paper-sunk'];
  context.fillRect(0, 0, size, size);
  context.strokeStyle = colours['rule-strong'];
  context.globalAlpha = 0.55;
  context.lineWidth = 1;
  context.beginPath();
  for (const offset of [-size, 0, size]) {
    context.moveTo(offset, size);
    context.lineTo(offset + size, 0);
  }
  context.stroke();
  map.addImage('unmapped-hatch', context.getImageData(0, 0, size, size));
  map.setPaintProperty('outside', 'background-pattern', 'unmapped-hatch');
}

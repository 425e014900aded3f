import type { FeatureCollection } from 'geojson';
import type { GeoJSONSource, Map as MapLibreMap } from 'maplibre-gl';
import type { PlotCollection } from '../../core/model/designTypes';
import type { PlannerStore } from '../../state/plannerStore';
import { type ResultsColouring, resultsColouringSet } from '../../state/resultsStore';
import { resultsStore } from './resultsStoreInstance';

const SOURCE = 'sp-results-colour';

/** Measured plots as points carrying their ramp colour (empty when colouring is off). */
export function resultsColourSource(result: PlotCollection | null, colouring: ResultsColouring | null): FeatureCollection {
  if (!result || !colouring) return { type: 'FeatureCollection', features: [] };
  return {
    type: 'FeatureCollection',
    features: result.features
      .filter((f) => colouring.colours[f.properties.plot_id] !== undefined)
      .map((f) => ({ type: 'Feature', geometry: f.geometry, properties: { plot_id: f.properties.plot_id, colour: colouring.colours[f.properties.plot_id] } })),
  };
}

/**
 * Adds a layer that paints measured plots in the results colour ramp over the usual plot dots
 * (below the labels), and keeps it in step with the results store and the planner's plots; a
 * new design clears the colours until the Results step has checked the results against it.
 * Call once the map's style and site layers are loaded; returns an unsubscribe function.
 */
export function resultsMapLayerInstall(map: MapLibreMap, planner: PlannerStore): () => void {
  map.addSource(SOURCE, { type: 'geojson', data: resultsColourSource(null, null), promoteId: 'plot_id' });
  map.addLayer(
    {
      id: SOURCE,
      type: 'circle',
      source: SOURCE,
      paint: { 'circle-radius': 6.5, 'circle-color': ['get', 'colour'], 'circle-stroke-color': '#ffffff', 'circle-stroke-width': 1.5 },
    },
    map.getLayer('sp-strata-label') ? 'sp-strata-label' : undefined,
  );
  const push = () => (map.getSource(SOURCE) as GeoJSONSource | undefined)?.setData(resultsColourSource(planner.getState().result, resultsStore.getState().colouring));
  push();
  const offResults = resultsStore.subscribe((s, prev) => {
    if (s.colouring !== prev.colouring) push();
  });
  const offPlanner = planner.subscribe((s, prev) => {
    if (s.result === prev.result) return;
    // Colours were worked out for the old plots; new plots may reuse their ids at other places.
    if (resultsStore.getState().colouring) resultsColouringSet(resultsStore, null);
    else push();
  });
  return () => {
    offResults();
    offPlanner();
  };
}

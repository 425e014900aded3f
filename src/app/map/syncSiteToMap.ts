import type { Feature, FeatureCollection } from 'geojson';
import type { Map as MapLibreMap } from 'maplibre-gl';
import type { PlannerState, PlannerStore } from '../../state/plannerStore';
import { FOOTPRINTS_MIN_ZOOM, siteLayerSet } from './siteLayers';
import type { PlotCollection } from '../../core/model/designTypes';
import { accessSource, exclusionsSource, footprintsSource, plotsSource, strataSource } from './siteSources';

function selectionSource(s: PlannerState): FeatureCollection {
  const sel = s.selection;
  let feature: Feature | null = null;
  if (sel?.kind === 'part') {
    const p = s.site.parts.find((x) => x.id === sel.id);
    if (p) feature = { type: 'Feature', geometry: p.geometry, properties: { id: p.id } };
  } else if (sel?.kind === 'exclusion') {
    const e = s.site.exclusions.find((x) => x.id === sel.id);
    if (e) feature = { type: 'Feature', geometry: e.geometry, properties: { id: e.id } };
  }
  return { type: 'FeatureCollection', features: feature ? [feature] : [] };
}

function baselineSource(s: PlannerState): FeatureCollection {
  const b = s.design.method === 'transect' ? s.design.baseline : null;
  return { type: 'FeatureCollection', features: b ? [{ type: 'Feature', geometry: { type: 'LineString', coordinates: b }, properties: { id: 'baseline' } }] : [] };
}

/**
 * Pushes store state into the map's GeoJSON sources whenever the site, the design result or the
 * selection changes; buffered ground comes from the worker's analysis of the site.
 * Returns an unsubscribe function.
 */
export function syncSiteToMap(map: MapLibreMap, store: PlannerStore): () => void {
  const pushSite = (s: PlannerState) => {
    siteLayerSet(map, 'sp-strata', strataSource(s.site));
    siteLayerSet(map, 'sp-exclusions', exclusionsSource(s.site));
    siteLayerSet(map, 'sp-access', accessSource(s.site));
  };
  // Footprints are drawn only close in: they are built when the map nears that zoom, in a task of
  // their own, so a 10,000-plot design does not hold the page up for shapes nobody can see yet.
  let stopped = false;
  let footprintsOf: PlotCollection | null | undefined;
  const pushFootprints = () => {
    const result = store.getState().result;
    if (stopped || result === footprintsOf || (result && map.getZoom() < FOOTPRINTS_MIN_ZOOM - 1)) return;
    footprintsOf = result;
    siteLayerSet(map, 'sp-footprints', footprintsSource(result));
  };
  map.on('zoomend', pushFootprints);
  // A new result's plots go to the map in a task after the one that stored them: handing 10,000
  // plots to the map's worker (~40 ms) then does not add to the panels' drawing of the same result.
  let plotsOf: PlotCollection | null | undefined;
  const pushPlots = () => {
    const result = store.getState().result;
    if (stopped || result === plotsOf) return;
    plotsOf = result;
    siteLayerSet(map, 'sp-plots', plotsSource(result));
    setTimeout(pushFootprints, 0);
  };
  const pushResult = () => setTimeout(pushPlots, 0);
  const now = store.getState();
  pushSite(now);
  pushPlots();
  if (now.analysis) siteLayerSet(map, 'sp-buffers', now.analysis.buffers);
  siteLayerSet(map, 'sp-selection', selectionSource(now));
  siteLayerSet(map, 'sp-baseline', baselineSource(now));
  const unsubscribe = store.subscribe((s, prev) => {
    if (s.site !== prev.site) pushSite(s);
    if (s.result !== prev.result) pushResult();
    if (s.design !== prev.design) siteLayerSet(map, 'sp-baseline', baselineSource(s));
    if (s.analysis !== prev.analysis && s.analysis) siteLayerSet(map, 'sp-buffers', s.analysis.buffers);
    if (s.selection !== prev.selection || s.site !== prev.site) siteLayerSet(map, 'sp-selection', selectionSource(s));
  });
  return () => {
    stopped = true;
    unsubscribe();
    map.off('zoomend', pushFootprints);
  };
}

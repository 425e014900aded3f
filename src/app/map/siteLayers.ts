import type { GeoJSONSource, Map as MapLibreMap } from 'maplibre-gl';
import type { FeatureCollection } from 'geojson';
import { EXCLUSION_COLOURS, INK } from './palette';
import { LABEL_PREFIX } from './labelImages';
import { plotSymbolImageName, plotSymbolImagesInstall } from './plotSymbolImages';

/** Source ids of the planner's own map data. */
export const SOURCES = ['sp-strata', 'sp-buffers', 'sp-exclusions', 'sp-access', 'sp-plots', 'sp-footprints', 'sp-selection', 'sp-baseline'] as const;
export type SourceId = (typeof SOURCES)[number];

/** Zoom from which plot footprints are drawn (below it they would be a pixel or two). */
export const FOOTPRINTS_MIN_ZOOM = 16;

const kindColour: unknown[] = ['match', ['get', 'kind'], ...Object.entries(EXCLUSION_COLOURS).flat(), '#555555'];
const EMPTY: FeatureCollection = { type: 'FeatureCollection', features: [] };

/** Adds the planner's sources and layers above whatever base style is loaded. */
export function siteLayersAdd(map: MapLibreMap): void {
  plotSymbolImagesInstall(map);
  for (const id of SOURCES) {
    map.addSource(id, { type: 'geojson', data: EMPTY, promoteId: id === 'sp-plots' || id === 'sp-footprints' ? 'plot_id' : 'id' });
  }
  const c = kindColour as never;
  map.addLayer({ id: 'sp-strata-fill', type: 'fill', source: 'sp-strata', paint: { 'fill-color': ['get', 'colour'], 'fill-opacity': 0.28 } });
  map.addLayer({ id: 'sp-buffers-tint', type: 'fill', source: 'sp-buffers', paint: { 'fill-color': '#fbf7ea', 'fill-opacity': 0.45 } });
  map.addLayer({ id: 'sp-buffers-hatch', type: 'fill', source: 'sp-buffers', paint: { 'fill-pattern': ['concat', 'hatch-', ['get', 'kind']] } });
  map.addLayer({ id: 'sp-buffers-edge', type: 'line', source: 'sp-buffers', paint: { 'line-color': c, 'line-width': 1.6, 'line-dasharray': [3, 2] } });
  map.addLayer({ id: 'sp-strata-line', type: 'line', source: 'sp-strata', paint: { 'line-color': ['get', 'colour'], 'line-width': 2 } });
  map.addLayer({
    id: 'sp-exclusions-fill',
    type: 'fill',
    source: 'sp-exclusions',
    filter: ['==', ['geometry-type'], 'Polygon'],
    paint: { 'fill-color': c, 'fill-opacity': 0.25 },
  });
  map.addLayer({
    id: 'sp-exclusions-line',
    type: 'line',
    source: 'sp-exclusions',
    filter: ['!=', ['geometry-type'], 'Point'],
    paint: { 'line-color': c, 'line-width': ['match', ['get', 'kind'], 'cliff', 3, 2] },
  });
  map.addLayer({
    id: 'sp-exclusions-point',
    type: 'circle',
    source: 'sp-exclusions',
    filter: ['==', ['geometry-type'], 'Point'],
    paint: { 'circle-radius': 6, 'circle-color': '#ffffff', 'circle-stroke-color': c, 'circle-stroke-width': 3 },
  });
  map.addLayer({ id: 'sp-baseline', type: 'line', source: 'sp-baseline', paint: { 'line-color': INK, 'line-width': 2.5, 'line-dasharray': [4, 2] } });
  map.addLayer({ id: 'sp-selection-line', type: 'line', source: 'sp-selection', paint: { 'line-color': '#f2b134', 'line-width': 4, 'line-opacity': 0.9 } });
  map.addLayer({
    id: 'sp-footprints',
    type: 'line',
    source: 'sp-footprints',
    minzoom: FOOTPRINTS_MIN_ZOOM,
    paint: { 'line-color': INK, 'line-width': 1, 'line-dasharray': ['case', ['==', ['get', 'role'], 'reserve'], ['literal', [2, 2]], ['literal', [1, 0]]] as never },
  });
  map.addLayer({
    id: 'sp-access',
    type: 'circle',
    source: 'sp-access',
    paint: { 'circle-radius': 7, 'circle-color': '#ffffff', 'circle-stroke-color': INK, 'circle-stroke-width': 2.5 },
  });
  // The shared plot symbols (core/plotSymbols), rejected plots under the others (plotsSource orders them).
  map.addLayer({
    id: 'sp-plots',
    type: 'symbol',
    source: 'sp-plots',
    layout: {
      'icon-image': ['match', ['get', 'state'], 'reserve', plotSymbolImageName('reserve'), 'promoted', plotSymbolImageName('promoted'), 'rejected', plotSymbolImageName('rejected'), plotSymbolImageName('primary')],
      'icon-allow-overlap': true,
      'icon-ignore-placement': true,
      'symbol-z-order': 'source',
      // Smaller when the whole of a large site is in view, where full-size symbols only pile up.
      'icon-size': ['interpolate', ['linear'], ['zoom'], 12, 0.4, 15, 1],
    },
  });
  map.addLayer({
    id: 'sp-strata-label',
    type: 'symbol',
    source: 'sp-strata',
    layout: { 'icon-image': ['concat', `${LABEL_PREFIX}!`, ['get', 'code'], ' ', ['get', 'label']], 'icon-allow-overlap': false, 'symbol-placement': 'point', 'symbol-sort-key': ['get', 'label_rank'] },
  });
  map.addLayer({
    id: 'sp-exclusions-label',
    type: 'symbol',
    source: 'sp-exclusions',
    minzoom: 14,
    layout: { 'icon-image': ['concat', LABEL_PREFIX, ['get', 'kind'], ': ', ['get', 'name']], 'icon-anchor': 'top', 'icon-offset': [0, 6] },
  });
  map.addLayer({
    id: 'sp-access-label',
    type: 'symbol',
    source: 'sp-access',
    layout: { 'icon-image': ['concat', LABEL_PREFIX, ['get', 'name']], 'icon-anchor': 'left', 'icon-offset': [10, 0], 'icon-allow-overlap': true },
  });
  map.addLayer({
    id: 'sp-plots-label',
    type: 'symbol',
    source: 'sp-plots',
    minzoom: 15,
    layout: {
      'icon-image': ['concat', LABEL_PREFIX, ['get', 'plot_id'], ['match', ['get', 'state'], 'rejected', ' rejected', 'promoted', ['concat', ' replaces ', ['get', 'replaces']], '']],
      'icon-anchor': 'left',
      'icon-offset': [7, 0],
    },
  });
}

/** Replaces one source's data. */
export function siteLayerSet(map: MapLibreMap, id: SourceId, data: FeatureCollection): void {
  (map.getSource(id) as GeoJSONSource | undefined)?.setData(data);
}

import type { FeatureCollection } from 'geojson';
import { type GeoJSONSource, type Map as MapLibreMap, Popup } from 'maplibre-gl';
import type { PlotsCheckReport } from '../../core/plotCheck/plotCheckTypes';
import { plotCheckIconRgba } from '../../io/common/plotIcons';
import { LABEL_PREFIX } from '../map/labelImages';
import { plotCheckFollowSite, plotCheckStore } from './plotCheckStoreInstance';
import { plotCheckPopupContent } from './plotCheckPopup';

/** Source and layer id of the checked plots (the map's click handler leaves them to this module). */
export const PLOT_CHECK_LAYER = 'sp-check-plots';
const LABELS = 'sp-check-plots-label';
const RING = 'sp-check-plots-selected';
/** The design's own plot layers, hidden while the checked plots are shown instead of the design. */
const DESIGN_LAYERS = ['sp-plots', 'sp-plots-label', 'sp-footprints'];
const ICON_PX = 44;

/** The checked plots as points: index, id, pass or fail, and whether picked. */
export function plotCheckSource(report: PlotsCheckReport | null, selected: number | null): FeatureCollection {
  if (!report) return { type: 'FeatureCollection', features: [] };
  return {
    type: 'FeatureCollection',
    features: report.plots.map((r) => ({
      type: 'Feature',
      id: r.index,
      geometry: { type: 'Point', coordinates: [r.lon, r.lat] },
      properties: { index: r.index, id: r.id, check: r.ok ? 'pass' : 'fail', severity: r.severity, selected: r.index === selected },
    })),
  };
}

/**
 * Draws the checked plots over the site (failing ones in the warning symbol on top, passing ones
 * open), labels the failing ones, rings the one picked in the table, opens its reasons on click,
 * and hides the design's plots when the check is shown instead of the design. Follows the
 * plot-check store; call once the site layers are on the map. Returns an unsubscribe function.
 */
export function plotCheckMapLayerInstall(map: MapLibreMap): () => void {
  for (const key of ['fail', 'pass'] as const) {
    if (!map.hasImage(`check-${key}`)) map.addImage(`check-${key}`, { width: ICON_PX, height: ICON_PX, data: plotCheckIconRgba(key, ICON_PX) }, { pixelRatio: 2 });
  }
  map.addSource(PLOT_CHECK_LAYER, { type: 'geojson', data: plotCheckSource(null, null) });
  const below = map.getLayer('sp-strata-label') ? 'sp-strata-label' : undefined;
  map.addLayer(
    { id: RING, type: 'circle', source: PLOT_CHECK_LAYER, filter: ['==', ['get', 'selected'], true], paint: { 'circle-radius': 16, 'circle-color': 'rgba(0,0,0,0)', 'circle-stroke-color': '#1d2a2e', 'circle-stroke-width': 2.5 } },
    below,
  );
  map.addLayer(
    {
      id: PLOT_CHECK_LAYER,
      type: 'symbol',
      source: PLOT_CHECK_LAYER,
      layout: { 'icon-image': ['concat', 'check-', ['get', 'check']], 'icon-allow-overlap': true, 'icon-ignore-placement': true, 'symbol-sort-key': ['get', 'severity'] },
    },
    below,
  );
  map.addLayer({
    id: LABELS,
    type: 'symbol',
    source: PLOT_CHECK_LAYER,
    filter: ['==', ['get', 'check'], 'fail'],
    minzoom: 13,
    layout: { 'icon-image': ['concat', LABEL_PREFIX, ['get', 'id']], 'icon-anchor': 'left', 'icon-offset': [12, 0] },
  });
  const popup = new Popup({ closeButton: true, maxWidth: '340px' });
  const show = (index: number) => {
    const r = plotCheckStore.getState().report?.plots[index];
    if (!r) {
      popup.remove();
      return;
    }
    popup.setLngLat([r.lon, r.lat]).setDOMContent(plotCheckPopupContent(r)).addTo(map);
  };
  const push = () => {
    const s = plotCheckStore.getState();
    (map.getSource(PLOT_CHECK_LAYER) as GeoJSONSource | undefined)?.setData(plotCheckSource(s.report, s.selected));
    const visibility = s.showDesign || !s.report ? 'visible' : 'none';
    for (const id of DESIGN_LAYERS) if (map.getLayer(id)) map.setLayoutProperty(id, 'visibility', visibility);
  };
  push();
  const off = plotCheckStore.subscribe((s, prev) => {
    if (s.report !== prev.report || s.selected !== prev.selected || s.showDesign !== prev.showDesign) push();
    if (s.report !== prev.report && !s.report) popup.remove();
    if (s.selected !== null && (s.selected !== prev.selected || s.report !== prev.report)) show(s.selected);
  });
  map.on('click', PLOT_CHECK_LAYER, (e) => {
    const index = Number(e.features?.[0]?.properties?.index);
    if (!Number.isInteger(index)) return;
    if (plotCheckStore.getState().selected === index) show(index);
    else plotCheckStore.setState({ selected: index });
  });
  const offSite = plotCheckFollowSite();
  return () => {
    off();
    offSite();
    popup.remove();
  };
}

import { Map as MapLibreMap, NavigationControl, Popup, ScaleControl, setWorkerUrl } from 'maplibre-gl';
import workerUrl from 'maplibre-gl/dist/maplibre-gl-worker.mjs?url';
import { useEffect, useRef } from 'react';
import { plotFieldStates } from '../../core/field/plotFieldState';
import type { PlannerState } from '../../state/plannerStore';
import { DEMO_SITE_NAME } from '../demoSite';
import { DEMO_IMAGE_NAME, imageryLoadDemo } from '../imageryLoad';
import { imageryRemove } from './imageryControl';
import { plannerStore } from '../plannerStoreInstance';
import { notify } from '../usePlanner';
import { drawControlInstall } from './drawControl';
import { hatchImagesInstall, labelImagesInstall } from './labelImages';
import { mapFitPadding } from './mapFitPadding';
import { mapHandleSet } from './mapHandle';
import { mapStyleInitial, mapStyleLandInstall } from './mapStyle';
import { plotPopupContent } from './plotPopup';
import { siteBounds } from './siteBounds';
import { siteLayersAdd } from './siteLayers';
import { EXCLUSION_COLOURS } from './palette';
import { syncSiteToMap } from './syncSiteToMap';
import { resultsMapLayerInstall } from '../results/resultsMapLayer';
import { PLOT_CHECK_LAYER, plotCheckMapLayerInstall } from '../plotCheck/plotCheckMapLayer';
import { stratumLabel } from '../../core/field/stratumLabel';

setWorkerUrl(workerUrl);

declare global {
  interface Window {
    /** The planner's map, for the browser tests. */
    __stratplotMap?: MapLibreMap;
  }
}

const CLICK_LAYERS = [PLOT_CHECK_LAYER, 'sp-plots', 'sp-access', 'sp-exclusions-point', 'sp-exclusions-line', 'sp-exclusions-fill', 'sp-strata-fill'];

/** Mounts the map, keeps its sources in step with the store, and turns clicks into selections and popups. */
export function MapView() {
  const holder = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!holder.current) return;
    const map = new MapLibreMap({
      container: holder.current,
      style: mapStyleInitial(),
      center: [0, 0],
      zoom: 1,
      attributionControl: { compact: true },
      canvasContextAttributes: { preserveDrawingBuffer: true },
      maxPitch: 0,
      dragRotate: false,
    });
    map.touchZoomRotate.disableRotation();
    map.addControl(new ScaleControl({ unit: 'metric', maxWidth: 140 }), 'bottom-left');
    map.addControl(new NavigationControl({ showCompass: false }), 'top-right');
    const popup = new Popup({ closeButton: true, maxWidth: '300px' });
    // The plot whose popup is open: its content follows the plan (a rejection, a restore, a rename).
    let popupPlot: string | null = null;
    popup.on('close', () => {
      popupPlot = null;
    });
    const popupShow = (s: PlannerState, plotId: string): boolean => {
      const plot = s.result?.features.find((f) => f.properties.plot_id === plotId);
      if (!plot) return false;
      const p = plot.properties;
      const stratum = s.site.strata.find((x) => x.key === p.stratum);
      const label = stratum ? stratumLabel(stratum.label, stratum.code) : p.stratum;
      const state = plotFieldStates(s.result!.features.map((f) => f.properties)).get(p.plot_id);
      popup.setDOMContent(plotPopupContent(p, label, state));
      return true;
    };
    const cleanups: (() => void)[] = [];
    labelImagesInstall(map);
    map.on('load', () => {
      hatchImagesInstall(map, EXCLUSION_COLOURS);
      mapStyleLandInstall(map);
      siteLayersAdd(map);
      cleanups.push(syncSiteToMap(map, plannerStore));
      cleanups.push(resultsMapLayerInstall(map, plannerStore));
      cleanups.push(plotCheckMapLayerInstall(map));
      cleanups.push(drawControlInstall(map, plannerStore, notify));
      const b = siteBounds(plannerStore.getState().site);
      if (b) map.fitBounds(b, { padding: mapFitPadding(map), duration: 0 });
      cleanups.push(
        plannerStore.subscribe((s, prev) => {
          if (s.focus && s.focus !== prev.focus) map.fitBounds(s.focus.bbox, { padding: mapFitPadding(map, 20), maxZoom: 18, duration: 400 });
          if (popupPlot && (s.result !== prev.result || s.site.strata !== prev.site.strata) && !popupShow(s, popupPlot)) popup.remove();
        }),
      );
      map.on('click', (e) => {
        if (plannerStore.getState().tool !== 'none') return;
        const hits = map.queryRenderedFeatures(e.point, { layers: CLICK_LAYERS.filter((l) => map.getLayer(l)) });
        const hit = hits[0];
        // Checked plots open their own popup (plotCheckMapLayer).
        if (hit?.layer.id === PLOT_CHECK_LAYER) return;
        if (!hit) {
          plannerStore.setState({ selection: null });
          popup.remove();
          return;
        }
        const id = String(hit.properties.id ?? hit.properties.plot_id);
        if (hit.layer.id === 'sp-plots') {
          const s = plannerStore.getState();
          const plot = s.result?.features.find((f) => f.properties.plot_id === hit.properties.plot_id);
          if (!plot) return;
          const p = plot.properties;
          plannerStore.setState({ selection: { kind: 'plot', id: p.plot_id } });
          popupShow(s, p.plot_id);
          popup.setLngLat([p.lon, p.lat]).addTo(map);
          popupPlot = p.plot_id;
          return;
        }
        popup.remove();
        const kind = hit.layer.id === 'sp-strata-fill' ? 'part' : hit.layer.id === 'sp-access' ? 'access' : 'exclusion';
        plannerStore.setState({ selection: { kind, id } });
      });
      window.__stratplotMap = map;
      mapHandleSet(map);
      if (plannerStore.getState().site.name === DEMO_SITE_NAME) void imageryLoadDemo();
      cleanups.push(
        plannerStore.subscribe((s, prev) => {
          if (s.site.name === prev.site.name) return;
          // Another plan was opened: the demo's synthetic image belongs to the demo only.
          if (s.site.name === DEMO_SITE_NAME) void imageryLoadDemo();
          else if (s.imagery?.label.startsWith(DEMO_IMAGE_NAME)) {
            imageryRemove(map);
            plannerStore.setState({ imagery: null });
          }
          const b = siteBounds(s.site);
          if (b) map.fitBounds(b, { padding: mapFitPadding(map), duration: 0 });
        }),
      );
    });
    return () => {
      for (const c of cleanups) c();
      mapHandleSet(null);
      map.remove();
    };
  }, []);
  return <div className="map-holder" ref={holder} role="application" aria-label="Site map: strata, exclusions with safety buffers, access points and plots" />;
}

import type { Map as MapLibreMap } from 'maplibre-gl';
import { PLOT_FIELD_STATE_KEYS, type PlotFieldStateKey } from '../../core/field/plotFieldState';
import { plotIconPng, plotIconRgba } from '../../io/common/plotIcons';

/** Pixels of a map plot symbol (drawn at twice the CSS size for sharp edges). */
const MAP_ICON_PX = 36;

/** Name of a plot symbol among the map's images. */
export function plotSymbolImageName(key: PlotFieldStateKey): string {
  return `plot-${key}`;
}

/** Adds the shared plot symbols (io/plotIcons, as in the KMZ) to the map's images. */
export function plotSymbolImagesInstall(map: MapLibreMap): void {
  for (const key of PLOT_FIELD_STATE_KEYS) {
    const name = plotSymbolImageName(key);
    if (map.hasImage(name)) continue;
    map.addImage(name, { width: MAP_ICON_PX, height: MAP_ICON_PX, data: plotIconRgba(key, MAP_ICON_PX) }, { pixelRatio: 2 });
  }
  // The key's PNGs are made while the page is idle, not in the task that first shows a design.
  const idle = window.requestIdleCallback ?? ((f: () => void) => setTimeout(f, 200));
  idle(() => {
    for (const key of PLOT_FIELD_STATE_KEYS) plotSymbolDataUrl(key);
  });
}

const urls = new Map<PlotFieldStateKey, string>();

/** The plot symbol as a PNG data URL, for the map key and the Plots step. */
export function plotSymbolDataUrl(key: PlotFieldStateKey): string {
  let url = urls.get(key);
  if (!url) {
    const png = plotIconPng(key, MAP_ICON_PX);
    let bin = '';
    for (const b of png) bin += String.fromCharCode(b);
    url = `data:image/png;base64,${btoa(bin)}`;
    urls.set(key, url);
  }
  return url;
}

import type { PlotCheckSymbolKey } from '../../core/plotCheck/plotCheckSymbols';
import { plotCheckIconPng } from '../../io/common/plotIcons';

const urls = new Map<PlotCheckSymbolKey, string>();

/** A checked-plot symbol as a PNG data URL, for the Plots step and the map key (the map draws the same pixels). */
export function plotCheckSymbolDataUrl(key: PlotCheckSymbolKey): string {
  let url = urls.get(key);
  if (!url) {
    const png = plotCheckIconPng(key, 36);
    let bin = '';
    for (const b of png) bin += String.fromCharCode(b);
    url = `data:image/png;base64,${btoa(bin)}`;
    urls.set(key, url);
  }
  return url;
}

import type { Map as MapLibreMap, PaddingOptions } from 'maplibre-gl';

/**
 * Padding in CSS pixels for fitting the site into the map so nothing of it sits under the key
 * (top left), the zoom buttons (top right) or the scale and credit (bottom), and labels placed
 * beside points near the edge (access points are labelled to their right) stay inside the map.
 * On a small map every side shrinks in proportion so the site is not squeezed to a dot.
 */
export function mapFitPadding(map: MapLibreMap, extra = 0): PaddingOptions {
  const holder = map.getContainer();
  const w = holder.clientWidth;
  const h = holder.clientHeight;
  const box = holder.getBoundingClientRect();
  const legend = holder.parentElement?.querySelector<HTMLElement>('.legend');
  let left = 36;
  let top = 36;
  if (legend) {
    const r = legend.getBoundingClientRect();
    // A tall key is cleared sideways, a short (folded) one from above.
    if (r.height > h * 0.3) left = Math.max(left, r.right - box.left + 16);
    else top = Math.max(top, r.bottom - box.top + 12);
  }
  const pad = { top: top + extra, bottom: 44 + extra, left: left + extra, right: 60 + Math.min(110, w * 0.2) + extra };
  // Keep at least 40 % of each side for the site itself.
  const across = Math.min(1, (w * 0.6) / (pad.left + pad.right));
  const down = Math.min(1, (h * 0.6) / (pad.top + pad.bottom));
  return { top: pad.top * down, bottom: pad.bottom * down, left: pad.left * across, right: pad.right * across };
}

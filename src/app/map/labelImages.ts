import type { Map as MapLibreMap } from 'maplibre-gl';

/** Prefix of image ids that are drawn on demand as text labels. */
export const LABEL_PREFIX = 'txt:';

/**
 * Draws map labels as images on demand: a symbol layer asks for `txt:<text>` and the text is
 * painted on a canvas with the page's own system font and a light halo. This keeps the map free of
 * glyph servers (it runs offline) and treats imported names strictly as text, never as markup.
 */
export function labelImagesInstall(map: MapLibreMap): void {
  const ratio = Math.min(2, Math.max(1, globalThis.devicePixelRatio || 1));
  const canvas = document.createElement('canvas');
  const ctx = canvas.getContext('2d', { willReadFrequently: true });
  if (!ctx) return;
  map.setMissingStyleImageResolver((id) => {
    if (!id.startsWith(LABEL_PREFIX) || map.hasImage(id)) return;
    const bold = id.startsWith(`${LABEL_PREFIX}!`);
    const text = id.slice(LABEL_PREFIX.length + (bold ? 1 : 0)).slice(0, 60);
    const font = `${bold ? 600 : 500} ${12 * ratio}px system-ui, -apple-system, "Segoe UI", Roboto, sans-serif`;
    ctx.font = font;
    const w = Math.ceil(ctx.measureText(text).width + 8 * ratio);
    const h = Math.ceil(18 * ratio);
    canvas.width = w;
    canvas.height = h;
    ctx.font = font;
    ctx.textBaseline = 'middle';
    ctx.lineJoin = 'round';
    ctx.lineWidth = 3 * ratio;
    ctx.strokeStyle = 'rgba(250, 248, 242, 0.95)';
    ctx.fillStyle = '#1d2a2e';
    ctx.strokeText(text, 4 * ratio, h / 2);
    ctx.fillText(text, 4 * ratio, h / 2);
    const data = ctx.getImageData(0, 0, w, h);
    map.addImage(id, { width: w, height: h, data: new Uint8Array(data.data.buffer) }, { pixelRatio: ratio });
  });
}

/** Diagonal hatch tiles for buffered ground, one per exclusion kind (pattern plus colour, never colour alone). */
export function hatchImagesInstall(map: MapLibreMap, colours: Record<string, string>): void {
  const size = 10;
  for (const [kind, colour] of Object.entries(colours)) {
    const canvas = document.createElement('canvas');
    canvas.width = size;
    canvas.height = size;
    const ctx = canvas.getContext('2d');
    if (!ctx) continue;
    ctx.strokeStyle = colour;
    ctx.lineWidth = kind === 'water' ? 1.2 : 1.6;
    ctx.beginPath();
    if (kind === 'water') {
      // Water: horizontal rules; the others diagonal, so kinds differ by pattern as well as colour.
      ctx.moveTo(0, 3);
      ctx.lineTo(size, 3);
      ctx.moveTo(0, 8);
      ctx.lineTo(size, 8);
    } else if (kind === 'private') {
      ctx.moveTo(0, 0);
      ctx.lineTo(size, size);
      ctx.moveTo(size, 0);
      ctx.lineTo(0, size);
    } else {
      ctx.moveTo(-1, size + 1);
      ctx.lineTo(size + 1, -1);
      ctx.moveTo(-1, 1);
      ctx.lineTo(1, -1);
      ctx.moveTo(size - 1, size + 1);
      ctx.lineTo(size + 1, size - 1);
    }
    ctx.stroke();
    const data = ctx.getImageData(0, 0, size, size);
    map.addImage(`hatch-${kind}`, { width: size, height: size, data: new Uint8Array(data.data.buffer) });
  }
}

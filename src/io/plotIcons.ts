import { pngEncodeRgba } from './pngEncodeRgba';

/** Plot marker colours of our own choosing (#rrggbb): deep teal for primaries, burnt amber for reserves. */
export const PLOT_COLOURS = { primary: '#0f6e8c', reserve: '#b8621b' } as const;

function hex(c: string): [number, number, number] {
  return [Number.parseInt(c.slice(1, 3), 16), Number.parseInt(c.slice(3, 5), 16), Number.parseInt(c.slice(5, 7), 16)];
}

/**
 * 32×32 PNG markers for plots: a primary is a solid disc with a white centre dot, a reserve a
 * hollow diamond, so the two differ in shape as well as colour (readable in black and white
 * and by colour-blind crews). Edges are anti-aliased by 4×4 supersampling.
 */
export function plotIconPng(role: 'primary' | 'reserve'): Uint8Array {
  const size = 32;
  const [r, g, b] = hex(PLOT_COLOURS[role]);
  const rgba = new Uint8Array(size * size * 4);
  const c = (size - 1) / 2;
  const inside = (x: number, y: number): 'ink' | 'white' | null => {
    const dx = x - c;
    const dy = y - c;
    if (role === 'primary') {
      const d = Math.hypot(dx, dy);
      if (d <= 3.5) return 'white';
      return d <= 13 ? 'ink' : null;
    }
    const m = Math.abs(dx) + Math.abs(dy);
    return m <= 15 && m >= 9 ? 'ink' : null;
  };
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      let ink = 0;
      let white = 0;
      for (let sy = 0; sy < 4; sy++) {
        for (let sx = 0; sx < 4; sx++) {
          const hit = inside(x - 0.375 + sx * 0.25, y - 0.375 + sy * 0.25);
          if (hit === 'ink') ink++;
          else if (hit === 'white') white++;
        }
      }
      const cover = (ink + white) / 16;
      const w = white / Math.max(1, ink + white);
      const at = (y * size + x) * 4;
      rgba[at] = Math.round(r + (255 - r) * w);
      rgba[at + 1] = Math.round(g + (255 - g) * w);
      rgba[at + 2] = Math.round(b + (255 - b) * w);
      rgba[at + 3] = Math.round(255 * cover);
    }
  }
  return pngEncodeRgba(size, size, rgba);
}

import { PLOT_CHECK_SYMBOLS, type PlotCheckSymbolKey, plotCheckSymbolCover } from '../../core/plotCheck/plotCheckSymbols';
import type { PlotFieldStateKey } from '../../core/field/plotFieldState';
import { PLOT_SYMBOLS, plotSymbolCover } from '../../core/field/plotSymbols';
import { pngEncodeRgba } from './pngEncodeRgba';

function hex(c: string): [number, number, number] {
  return [Number.parseInt(c.slice(1, 3), 16), Number.parseInt(c.slice(3, 5), 16), Number.parseInt(c.slice(5, 7), 16)];
}

/**
 * A plot marker of the shared symbol code (core/plotSymbols) as straight RGBA pixels, `size`
 * square: primary a solid disc with a white centre dot, reserve an open diamond, promoted reserve
 * a solid magenta diamond with a white dot, rejected an open grey disc struck through, each with
 * a thin white halo for imagery. Edges are anti-aliased by 4×4 supersampling. The planner's map
 * and key draw these pixels, the KMZ embeds them as PNG.
 */
export function plotIconRgba(key: PlotFieldStateKey, size = 32): Uint8Array {
  const sym = PLOT_SYMBOLS[key];
  return symbolIconRgba((x, y) => plotSymbolCover(sym, x, y), { fill: sym.fill, ink: sym.ink }, size);
}

/**
 * Straight RGBA pixels, `size` square, of a symbol given by its cover function (which part covers a
 * point, in units of the symbol radius from its centre, y down), anti-aliased by 4×4 supersampling.
 */
export function symbolIconRgba(cover: (x: number, y: number) => 'fill' | 'ink' | 'white' | null, ink: { fill: string; ink: string }, size: number): Uint8Array {
  const colours = { fill: hex(ink.fill), ink: hex(ink.ink), white: [255, 255, 255] as [number, number, number] };
  const rgba = new Uint8Array(size * size * 4);
  const c = size / 2;
  const unit = size / 2;
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const sum = [0, 0, 0];
      let hits = 0;
      for (let sy = 0; sy < 4; sy++) {
        for (let sx = 0; sx < 4; sx++) {
          const part = cover((x + 0.125 + sx * 0.25 - c) / unit, (y + 0.125 + sy * 0.25 - c) / unit);
          if (!part) continue;
          const rgb = colours[part];
          sum[0] += rgb[0];
          sum[1] += rgb[1];
          sum[2] += rgb[2];
          hits++;
        }
      }
      const at = (y * size + x) * 4;
      if (hits === 0) continue;
      rgba[at] = Math.round(sum[0] / hits);
      rgba[at + 1] = Math.round(sum[1] / hits);
      rgba[at + 2] = Math.round(sum[2] / hits);
      rgba[at + 3] = Math.round((255 * hits) / 16);
    }
  }
  return rgba;
}

/** The marker of {@link plotIconRgba} as a PNG file (32×32), for KMZ icons. */
export function plotIconPng(key: PlotFieldStateKey, size = 32): Uint8Array {
  return pngEncodeRgba(size, size, plotIconRgba(key, size));
}

/** A checked plot's marker (core/plotCheckSymbols: a solid yellow hexagon with a mark when it fails, open when it passes) as RGBA pixels. */
export function plotCheckIconRgba(key: PlotCheckSymbolKey, size = 32): Uint8Array {
  const sym = PLOT_CHECK_SYMBOLS[key];
  return symbolIconRgba((x, y) => plotCheckSymbolCover(sym, x, y), { fill: sym.fill, ink: sym.ink }, size);
}

/** The marker of {@link plotCheckIconRgba} as a PNG file. */
export function plotCheckIconPng(key: PlotCheckSymbolKey, size = 32): Uint8Array {
  return pngEncodeRgba(size, size, plotCheckIconRgba(key, size));
}

import { PLOT_INK } from './plotSymbols';

/** The two states of a plot checked from someone else's file. */
export type PlotCheckSymbolKey = 'fail' | 'pass';

/** How a checked plot is drawn, in units of the symbol's radius (y pointing down, as on screens and PDF pages). */
export interface PlotCheckSymbol {
  key: PlotCheckSymbolKey;
  /** Solid (filled with `fill`) or open (white inside a band of `ink`). */
  solid: boolean;
  /** An exclamation mark in `ink` inside the hexagon. */
  mark: boolean;
  fill: string;
  ink: string;
  label: string;
  short: string;
}

/**
 * Symbols of checked plots, our own design: a hexagon (a shape the plot symbol code, access points
 * and hazard marks do not use), solid signal yellow with a dark band and an exclamation mark for a
 * plot that fails, open for one that passes. Black on yellow is the usual warning contrast (the
 * colours of ISO 3864-1 warning signs); the yellow is kept clear of the hazard colour, every
 * exclusion colour and the plot symbol colours (the test beside this file measures ΔE*ab).
 */
export const PLOT_CHECK_SYMBOLS: Readonly<Record<PlotCheckSymbolKey, PlotCheckSymbol>> = {
  fail: { key: 'fail', solid: true, mark: true, fill: '#ffe600', ink: PLOT_INK, label: 'Checked plot that fails: click it for the reasons', short: 'Fails the check' },
  pass: { key: 'pass', solid: false, mark: false, fill: '#ffffff', ink: PLOT_INK, label: 'Checked plot that passes every check', short: 'Passes the check' },
};

/** Sizes of the symbol parts in units of the symbol radius (our own). */
export const PLOT_CHECK_SYMBOL_MEASURES = {
  /** Distance from the centre to a side of the hexagon (flat top and bottom). */
  apothem: 0.78,
  bandW: 0.2,
  haloW: 0.12,
  /** The mark's bar: half width, top and bottom (y down), and the dot's centre and radius. */
  barHalfW: 0.09,
  barTop: -0.5,
  barBottom: 0.1,
  dotY: 0.33,
  dotR: 0.1,
} as const;

/**
 * Which part of a checked-plot symbol covers (x, y), in units of its radius from the centre, y down:
 * 'fill', 'ink', 'white' (inside of an open symbol and a thin halo) or null. The hexagon has flat top
 * and bottom: its distance measure is max(|y|, (√3|x| + |y|)/2).
 */
export function plotCheckSymbolCover(s: PlotCheckSymbol, x: number, y: number): 'fill' | 'ink' | 'white' | null {
  const m = PLOT_CHECK_SYMBOL_MEASURES;
  const d = Math.max(Math.abs(y), (Math.sqrt(3) * Math.abs(x) + Math.abs(y)) / 2);
  if (d > m.apothem + m.haloW) return null;
  if (d > m.apothem) return 'white';
  if (d > m.apothem - m.bandW) return 'ink';
  if (s.mark && ((Math.abs(x) <= m.barHalfW && y >= m.barTop && y <= m.barBottom) || Math.hypot(x, y - m.dotY) <= m.dotR)) return 'ink';
  return s.solid ? 'fill' : 'white';
}

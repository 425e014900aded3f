import { PLOT_INK } from '../field/plotSymbols';

/** The two states of a plot checked from someone else's file. */
export type PlotCheckSymbolKey = 'fail' | 'pass';

/** How a checked plot is drawn, in units of the symbol's radius (y pointing down, as on screens and PDF pages). */
export interface PlotCheckSymbol {
  key: PlotCheckSymbolKey;
  /** Solid (filled with `fill`) or open (white inside a band of `ink`). */
  solid: boolean;
  /** The mark inside the hexagon, in `ink`: an exclamation mark (fails) or a tick (passes). */
  mark: 'exclamation' | 'tick';
  fill: string;
  ink: string;
  label: string;
  short: string;
}

/**
 * Symbols of checked plots, our own design: a hexagon (a shape the plot symbol code, access points
 * and hazard marks do not use), solid signal yellow with a dark band and an exclamation mark for a
 * plot that fails, open with a tick for one that passes. The marks are ones no plot symbol carries
 * (plot symbols have a centre dot, a cross or nothing), so a checked plot never reads as a plot of
 * the design even where a hexagon and a disc look alike at small sizes. Black on yellow is the usual warning contrast (the
 * colours of ISO 3864-1 warning signs); the yellow is kept clear of the hazard colour, every
 * exclusion colour and the plot symbol colours (the test beside this file measures ΔE*ab).
 */
export const PLOT_CHECK_SYMBOLS: Readonly<Record<PlotCheckSymbolKey, PlotCheckSymbol>> = {
  fail: { key: 'fail', solid: true, mark: 'exclamation', fill: '#ffe600', ink: PLOT_INK, label: 'Checked plot that fails: click it for the reasons', short: 'Fails the check' },
  pass: { key: 'pass', solid: false, mark: 'tick', fill: '#ffffff', ink: PLOT_INK, label: 'Checked plot that passes every check', short: 'Passes the check' },
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
  /** The tick: a polyline through these points and its half width. */
  tick: [[-0.34, 0.02], [-0.1, 0.27], [0.36, -0.24]] as readonly (readonly [number, number])[],
  tickHalfW: 0.085,
} as const;

function segmentDistance(x: number, y: number, a: readonly [number, number], b: readonly [number, number]): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((x - a[0]) * dx + (y - a[1]) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(x - a[0] - t * dx, y - a[1] - t * dy);
}

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
  if (s.mark === 'exclamation' && ((Math.abs(x) <= m.barHalfW && y >= m.barTop && y <= m.barBottom) || Math.hypot(x, y - m.dotY) <= m.dotR)) return 'ink';
  if (s.mark === 'tick' && Math.min(segmentDistance(x, y, m.tick[0], m.tick[1]), segmentDistance(x, y, m.tick[1], m.tick[2])) <= m.tickHalfW) return 'ink';
  return s.solid ? 'fill' : 'white';
}

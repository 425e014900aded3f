import type { PlotFieldStateKey } from './plotFieldState';

/**
 * How one field state is drawn, in units of the symbol's radius: a disc or a diamond, solid or
 * open (white inside a band of `ink`), with a white centre dot or struck through by a cross.
 * Active plots (primary, promoted) are solid; waiting and rejected ones are open, so the states
 * differ in shape and fill as well as colour and read in black and white.
 */
export interface PlotSymbol {
  key: PlotFieldStateKey;
  shape: 'disc' | 'diamond';
  solid: boolean;
  centreDot: boolean;
  struck: boolean;
  /** Fill of a solid symbol (#rrggbb); open symbols are white inside. */
  fill: string;
  /** Outline and cross (#rrggbb). */
  ink: string;
  /** What the symbol means, for keys and legends. */
  label: string;
  /** The same in a few words, for the narrow legend strip of the PDF maps. */
  short: string;
}

/** Dark ink of primary plots, reserves and access points. */
export const PLOT_INK = '#1d2a2e';

/**
 * The one symbol code for plots, shared by the planner map and key, the KML/KMZ icons and styles
 * and the PDF maps and legends (our own design). The promoted-reserve colour is Paul Tol's
 * "vibrant" magenta (Tol, "Colour Schemes", SRON/EPS/TN/09-002, issue 3.2, 2021), kept clear of
 * the hazard colour and of the results colour ramp (viridis); the test beside this file measures
 * the distances.
 */
export const PLOT_SYMBOLS: Readonly<Record<PlotFieldStateKey, PlotSymbol>> = {
  primary: { key: 'primary', shape: 'disc', solid: true, centreDot: true, struck: false, fill: PLOT_INK, ink: PLOT_INK, label: 'Primary plot: sample it', short: 'Primary plot' },
  reserve: { key: 'reserve', shape: 'diamond', solid: false, centreDot: false, struck: false, fill: '#ffffff', ink: PLOT_INK, label: 'Reserve, waiting: use in rank order', short: 'Reserve (waiting)' },
  promoted: { key: 'promoted', shape: 'diamond', solid: true, centreDot: true, struck: false, fill: '#ee3377', ink: PLOT_INK, label: 'Promoted reserve: sample it in place of a rejected plot', short: 'Promoted reserve (active)' },
  rejected: { key: 'rejected', shape: 'disc', solid: false, centreDot: false, struck: true, fill: '#ffffff', ink: '#6d6d6d', label: 'Rejected plot: do not visit', short: 'Rejected: do not visit' },
};

/**
 * Which part of a plot symbol covers the point (x, y), in units of the symbol's radius from its
 * centre (y down or up alike: the symbols are symmetric): 'fill', 'ink', 'white' (inside of open
 * symbols, the centre dot and a thin halo that keeps symbols visible on imagery) or null. Raster
 * icons sample this; vector drawings follow the same measures (PLOT_SYMBOL_MEASURES).
 */
export function plotSymbolCover(s: PlotSymbol, x: number, y: number): 'fill' | 'ink' | 'white' | null {
  const m = PLOT_SYMBOL_MEASURES;
  const d = s.shape === 'disc' ? Math.hypot(x, y) : (Math.abs(x) + Math.abs(y)) / Math.SQRT2;
  const outer = s.shape === 'disc' ? m.discR : m.diamondR;
  if (d > outer + m.haloW) return null;
  if (d > outer) return 'white';
  if (s.struck) {
    const bar = Math.min(Math.abs(x - y), Math.abs(x + y)) / Math.SQRT2;
    if (bar <= m.crossW / 2 && Math.max(Math.abs(x), Math.abs(y)) <= outer * 0.75) return 'ink';
  }
  if (s.centreDot && Math.hypot(x, y) <= m.dotR) return 'white';
  if (s.solid) return d > outer - m.bandW ? 'ink' : 'fill';
  return d > outer - m.bandW ? 'ink' : 'white';
}

/** Sizes of the symbol parts, in units of the symbol radius (our own). */
export const PLOT_SYMBOL_MEASURES = {
  /** Radius of a disc. */
  discR: 0.8,
  /** Distance from the centre to the side of a diamond (its corners are √2 times farther). */
  diamondR: 0.62,
  /** Width of the outline band. */
  bandW: 0.2,
  /** Width of the white halo outside. */
  haloW: 0.14,
  /** Radius of the white centre dot. */
  dotR: 0.24,
  /** Width of each bar of a rejected plot's cross. */
  crossW: 0.16,
} as const;

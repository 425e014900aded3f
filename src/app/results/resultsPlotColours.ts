import type { PlotCollection } from '../../core/model/designTypes';

/**
 * Ten evenly spaced stops of the viridis colour map (van der Walt & Smith, matplotlib 2.0, 2015),
 * as R's viridisLite prints viridis(10) (checked against copies of that output). Viridis is sequential, reads in
 * order for the common colour-vision deficiencies, and its lightness rises steadily, so it also
 * reads in grey-scale prints.
 */
export const VIRIDIS_STOPS = ['#440154', '#482878', '#3e4a89', '#31688e', '#26828e', '#1f9e89', '#35b779', '#6dcd59', '#b4de2c', '#fde725'] as const;

function hexRgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

const STOPS_RGB = VIRIDIS_STOPS.map(hexRgb);

/**
 * The ramp's colour at t in [0, 1] (clamped), by linear interpolation between neighbouring stops.
 * @returns #rrggbb
 */
export function resultsRampColour(t: number): string {
  const x = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0)) * (STOPS_RGB.length - 1);
  const i = Math.min(STOPS_RGB.length - 2, Math.floor(x));
  const f = x - i;
  const a = STOPS_RGB[i];
  const b = STOPS_RGB[i + 1];
  return `#${a.map((v, k) => Math.round(v + (b[k] - v) * f).toString(16).padStart(2, '0')).join('')}`;
}

/** Smallest and largest value of `variable` among the collection's plots; null when none has one. */
export function resultsValueRange(
  collection: PlotCollection,
  values: Readonly<Record<string, Readonly<Record<string, number>>>>,
  variable: string,
): { min: number; max: number } | null {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (const f of collection.features) {
    const v = values[f.properties.plot_id]?.[variable];
    if (v === undefined || !Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? { min, max } : null;
}

/**
 * Colours each measured plot of the collection by its value of `variable` on the viridis ramp,
 * lowest value darkest, scaled from the smallest to the largest value measured (all one colour,
 * the ramp's middle, when every value is the same). Plots without a value get no entry, so the
 * map keeps its usual symbol for them.
 * @param values valid measurements by plot id and variable, e.g. { "HEA-01": { cover: 35 } }
 * @returns plot_id → #rrggbb
 */
export function resultsPlotColours(
  collection: PlotCollection,
  values: Readonly<Record<string, Readonly<Record<string, number>>>>,
  variable: string,
): Record<string, string> {
  const range = resultsValueRange(collection, values, variable);
  const out: Record<string, string> = {};
  if (!range) return out;
  const span = range.max - range.min;
  for (const f of collection.features) {
    const id = f.properties.plot_id;
    const v = values[id]?.[variable];
    if (v === undefined || !Number.isFinite(v)) continue;
    out[id] = resultsRampColour(span > 0 ? (v - range.min) / span : 0.5);
  }
  return out;
}

/** Square metres in one hectare: every m² → ha conversion divides by this. */
export const M2_PER_HA = 10_000;

/**
 * `value` rounded at `decimals` decimal places the way Math.round rounds (halves up),
 * the rounding the design summary and allocation tables are written with.
 */
export function roundTo(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}

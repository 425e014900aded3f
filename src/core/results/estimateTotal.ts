import type { StratifiedEstimate } from './estimateStratifiedMean';
import { M2_PER_HA } from '../common/units';

/** A total over the basis area, from a stratified mean. */
export interface TotalEstimate {
  /** Mean density per hectare and its SE. */
  densityPerHa: number | null;
  densitySePerHa: number | null;
  /** Basis area the total covers, ha. */
  areaHa: number;
  total: number | null;
  totalSe: number | null;
  total_ci95: [number, number] | null;
}

export interface TotalOptions {
  /**
   * Plot footprint area in m²: a per-plot value divided by it is a density per m². Null when the
   * value is already a density per hectare (required for point plots, which have no area).
   */
  plotAreaM2: number | null;
}

/**
 * Estimated total over the strata (density per ha × ha) with its 95 % CI.
 * Y = A × ȳ_st/a for per-plot values (a = plot area), or A_ha × ȳ_st for values given per ha;
 * v(Y) = k² v(ȳ_st) for the constant k, so the CI is the mean's CI scaled (Cochran, Sampling
 * Techniques, 3rd ed. 1977, eq. 5.7 with N_h = A_h/a; equation number from memory).
 * @returns nulls where the mean or its SE is not available
 * @throws RangeError for a non-positive plot area (callers validate user input first)
 */
export function estimateTotal(estimate: StratifiedEstimate, options: TotalOptions): TotalEstimate {
  const areaHa = estimate.totalBasisM2 / M2_PER_HA;
  if (options.plotAreaM2 !== null && !(options.plotAreaM2 > 0)) {
    throw new RangeError(`estimateTotal: plot area must be > 0 m², got ${options.plotAreaM2}`);
  }
  const perHa = options.plotAreaM2 === null ? 1 : 10_000 / options.plotAreaM2;
  const densityPerHa = estimate.mean === null ? null : estimate.mean * perHa;
  const densitySePerHa = estimate.se === null ? null : estimate.se * perHa;
  const k = perHa * areaHa;
  return {
    densityPerHa,
    densitySePerHa,
    areaHa,
    total: densityPerHa === null ? null : densityPerHa * areaHa,
    totalSe: densitySePerHa === null ? null : densitySePerHa * areaHa,
    total_ci95: estimate.ci95 === null ? null : [estimate.ci95[0] * k, estimate.ci95[1] * k],
  };
}

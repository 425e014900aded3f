import type { AllocationStratum } from './allocateProportional';
import { type AllocationResult, allocateWithMinimum } from './allocateWithMinimum';
import { InputError } from '../../common/InputError';

/**
 * The Neyman weight of each stratum, A_h · S_h / √c_h, checking the pilot SDs and costs.
 * Throws InputError naming the stratum whose SD is missing or negative, or whose cost is not > 0.
 */
export function neymanWeights(
  strata: readonly AllocationStratum[],
  sd: Readonly<Record<string, number>>,
  cost: Readonly<Record<string, number>> = {},
): number[] {
  return strata.map((s) => {
    const sh = sd[s.key];
    if (sh === undefined || sh === null) {
      throw new InputError(`Neyman allocation needs a pilot standard deviation for stratum "${s.key}" (give --sd "${s.key}=VALUE")`);
    }
    if (!(Number.isFinite(sh) && sh >= 0)) throw new InputError(`pilot standard deviation of stratum "${s.key}" must be a number ≥ 0, got ${sh}`);
    const ch = cost[s.key] ?? 1;
    if (!(Number.isFinite(ch) && ch > 0)) throw new InputError(`relative cost of stratum "${s.key}" must be a number > 0, got ${ch}`);
    if (!(Number.isFinite(s.basisM2) && s.basisM2 >= 0)) throw new InputError(`stratum "${s.key}" has an invalid area ${s.basisM2} m²`);
    return (s.basisM2 * sh) / Math.sqrt(ch);
  });
}

/**
 * Neyman (optimum) allocation: n_h ∝ A_h · S_h / √c_h from pilot standard deviations S_h and relative
 * costs per plot c_h (1 when absent); rounded by largest remainder with the minimum rule of
 * {@link allocateWithMinimum}. With every S_h = 0 the plots are shared equally.
 * Source: Cochran, Sampling Techniques, 3rd ed. 1977, §5.5 (optimum allocation) and §5.9
 * (Neyman allocation; section and equation numbers from memory); the area A_h stands in for N_h in an areal frame.
 * @param strata key and basis area (m²)
 * @param sd pilot SD by stratum key
 * @param cost relative cost per plot by stratum key
 * @param n total primary plots
 * @param minPerStratum whole plots every stratum must get (default 2)
 * Throws InputError naming a stratum without an SD, or when the minimum cannot be met.
 */
export function allocateNeyman(
  strata: readonly AllocationStratum[],
  sd: Readonly<Record<string, number>>,
  cost: Readonly<Record<string, number>>,
  n: number,
  minPerStratum = 2,
): AllocationResult {
  const weights = neymanWeights(strata, sd, cost);
  return allocateWithMinimum(
    weights,
    n,
    minPerStratum,
    strata.map((s) => s.key),
  );
}

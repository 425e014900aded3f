import { type AllocationResult, allocateWithMinimum } from './allocateWithMinimum';

/**
 * Equal allocation: n / H plots in each of the H strata; the plots left over by whole division go,
 * one each, to the strata listed first (largest-remainder rounding with every remainder tied).
 * Source: Cochran, Sampling Techniques, 3rd ed. 1977, ch. 5 (equal allocation as a special case).
 * @param keys stratum keys, in stratum order
 * @param n total primary plots
 * @param minPerStratum whole plots every stratum must get (default 2)
 * Throws InputError when the minimum cannot be met.
 */
export function allocateEqual(keys: readonly string[], n: number, minPerStratum = 2): AllocationResult {
  return allocateWithMinimum(
    keys.map(() => 1),
    n,
    minPerStratum,
    keys,
  );
}

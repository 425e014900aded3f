/**
 * The radical inverse of `index` in `base` (Halton 1960): the digits of the index mirrored about the
 * radix point, in [0, 1). Index 1 in base 2 gives 1/2, index 2 gives 1/4, index 3 gives 3/4.
 * Source: J. H. Halton, Numerische Mathematik 2:84–90, 1960.
 * Throws a RangeError for a negative or non-integer index or a base below 2.
 */
export function haltonValue(index: number, base: number): number {
  if (!Number.isInteger(index) || index < 0) throw new RangeError(`Halton index must be a whole number ≥ 0, got ${index}`);
  if (!Number.isInteger(base) || base < 2) throw new RangeError(`Halton base must be a whole number ≥ 2, got ${base}`);
  let result = 0;
  let f = 1 / base;
  let i = index;
  while (i > 0) {
    result += f * (i % base);
    i = Math.floor(i / base);
    f /= base;
  }
  return result;
}

/**
 * Largest random skips used for a Balanced Acceptance Sampling start: Robertson et al. draw the
 * start of each Halton dimension uniformly; any integer range works, this one keeps indices exact
 * in doubles for billions of further points.
 */
export const HALTON_SKIP_MAX = 2 ** 31;

/**
 * Rounds real quotas to whole plots that sum exactly to `n` by the largest-remainder (Hamilton)
 * method: every stratum gets the floor of its quota, and the plots left over go one each to the
 * largest fractional remainders. Ties (equal remainders, to 1e-12) go to the larger exact quota
 * first, then to the stratum listed first — a stated rule, so the same inputs always round alike.
 * Source: the largest-remainder method of apportionment (Hamilton 1792; Balinski & Young,
 * Fair Representation, 2nd ed. 2001, ch. 2).
 * @param quotas non-negative real quotas, one per stratum, summing to `n` (within 1e-6 · n)
 * @param n the whole total the result must sum to
 * @returns whole plots per stratum, in the order of `quotas`
 * Throws a RangeError when the quotas are negative, not finite or do not sum to n.
 */
export function allocateLargestRemainder(quotas: readonly number[], n: number): number[] {
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`total must be a whole number ≥ 0, got ${n}`);
  let sum = 0;
  for (const q of quotas) {
    if (!(Number.isFinite(q) && q >= 0)) throw new RangeError(`quota ${q} is not a finite number ≥ 0`);
    sum += q;
  }
  if (quotas.length === 0) {
    if (n === 0) return [];
    throw new RangeError(`cannot share ${n} plots among no strata`);
  }
  if (Math.abs(sum - n) > 1e-6 * Math.max(1, n)) throw new RangeError(`quotas sum to ${sum}, not ${n}`);
  const plots = quotas.map((q) => Math.floor(q + 1e-9));
  let left = n - plots.reduce((a, b) => a + b, 0);
  if (left <= 0) {
    // Floating noise can push the floors past n by one; take back from the smallest remainders.
    return left === 0 ? plots : trimExcess(plots, quotas, -left);
  }
  const order = quotas
    .map((q, i) => ({ i, q, r: q - plots[i] }))
    .sort((a, b) => (Math.abs(b.r - a.r) > 1e-12 ? b.r - a.r : b.q !== a.q ? b.q - a.q : a.i - b.i));
  for (let k = 0; left > 0; k = (k + 1) % order.length, left--) plots[order[k].i]++;
  return plots;
}

function trimExcess(plots: number[], quotas: readonly number[], excess: number): number[] {
  const order = quotas
    .map((q, i) => ({ i, r: q - plots[i] }))
    .filter((o) => plots[o.i] > 0)
    .sort((a, b) => a.r - b.r || b.i - a.i);
  for (let k = 0; k < excess; k++) plots[order[k].i]--;
  return plots;
}

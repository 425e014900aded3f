/** One stratum of a collapsed group: its weight W_h = A_h/A and its estimated mean. */
export interface CollapsedMember {
  weight: number;
  mean: number;
}

/**
 * The collapsed-strata (between-strata) estimate of the variance of a group's share of the
 * stratified mean, Σ_h W_h ȳ_h over the group's strata, in the form of Hansen, Hurwitz & Madow
 * (1953) with the stratum areas as the size measure, as given by Cochran (Sampling Techniques, 3rd
 * ed. 1977, §5A.12, section number from memory):
 *   v_g = L/(L − 1) · Σ_h (y_h − (W_h/W_g) · y_g)²,  y_h = W_h ȳ_h, y_g = Σ_h y_h, W_g = Σ_h W_h,
 * L the number of strata in the group. For a pair of equal areas it is Cochran's (y_1 − y_2)². It
 * has L − 1 degrees of freedom and no finite-population correction.
 * @param members the group's strata (at least 2, weights > 0)
 * @throws RangeError for fewer than 2 strata or a weight that is not > 0 (programming errors)
 */
export function collapsedStrataVariance(members: readonly CollapsedMember[]): number {
  const l = members.length;
  if (l < 2) throw new RangeError(`collapsedStrataVariance: a group needs at least 2 strata, got ${l}`);
  let wg = 0;
  let yg = 0;
  for (const m of members) {
    if (!(m.weight > 0) || !Number.isFinite(m.mean)) throw new RangeError('collapsedStrataVariance: every stratum needs a weight > 0 and a mean');
    wg += m.weight;
    yg += m.weight * m.mean;
  }
  let sum = 0;
  for (const m of members) {
    const d = m.weight * m.mean - (m.weight / wg) * yg;
    sum += d * d;
  }
  return (l / (l - 1)) * sum;
}

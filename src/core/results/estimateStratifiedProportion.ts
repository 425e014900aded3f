import { estimateStratifiedMean, type StratifiedEstimate, type StratifiedMeanOptions } from './estimateStratifiedMean';

/** Presence counts of one stratum. */
export interface StratumPresence {
  stratum: string;
  /** Basis area of the stratum, m². */
  basisM2: number;
  /** Plots observed. */
  n: number;
  /** Plots where the species or feature was present. */
  present: number;
}

/**
 * Stratified estimate of a proportion (e.g. the share of ground where a species is present).
 * p_st = Σ W_h p_h; v(p_st) = Σ W_h² (1 − f_h) p_h(1 − p_h)/(n_h − 1) (Cochran, Sampling Techniques,
 * 3rd ed. 1977, §5.8, eqs. 5.51–5.52, numbers from memory). This is the stratified mean of 0/1 values, whose s_h² is
 * n_h p_h(1 − p_h)/(n_h − 1), so df and CI follow {@link estimateStratifiedMean}; the CI is a Wald
 * interval with Student t on Satterthwaite df, clipped to [0, 1].
 * @throws RangeError when present is outside 0..n (callers validate user input first)
 */
export function estimateStratifiedProportion(
  strata: readonly StratumPresence[],
  options: StratifiedMeanOptions,
): StratifiedEstimate {
  const summaries = strata.map((s) => {
    if (!(s.present >= 0 && s.present <= s.n)) {
      throw new RangeError(`estimateStratifiedProportion: ${s.present} present of ${s.n} in ${s.stratum}`);
    }
    if (s.n === 0) return { stratum: s.stratum, basisM2: s.basisM2, n: 0, mean: null, sd: null };
    const p = s.present / s.n;
    const sd = s.n < 2 ? null : Math.sqrt((s.n * p * (1 - p)) / (s.n - 1));
    return { stratum: s.stratum, basisM2: s.basisM2, n: s.n, mean: p, sd };
  });
  const e = estimateStratifiedMean(summaries, options);
  if (e.ci95 === null) return e;
  const ci95: [number, number] = [Math.max(0, e.ci95[0]), Math.min(1, e.ci95[1])];
  const warnings = [...e.warnings];
  if (strata.some((s) => s.n >= 2 && (s.present === 0 || s.present === s.n))) {
    warnings.push(
      'a stratum has the species present in none or all of its plots: its variance is estimated as 0 and the CI is too narrow',
    );
  }
  return { ...e, ci95, warnings };
}

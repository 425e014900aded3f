import { collapsedStrataVariance } from './collapsedStrataVariance';
import { type SatterthwaiteTerm, satterthwaiteDf } from '../stats/satterthwaiteDf';
import { tQuantile95 } from '../stats/tQuantile';

/** What the estimator needs to know about one stratum. */
export interface StratumSummary {
  stratum: string;
  /** Area of the stratum the plots represent (usable or mapped, per the design's share basis), m². */
  basisM2: number;
  n: number;
  mean: number | null;
  sd: number | null;
}

/** One stratum's row of the estimate. */
export interface StratumEstimateRow {
  stratum: string;
  n: number;
  mean: number | null;
  sd: number | null;
  /** SE of the stratum mean with its finite-population correction, √((1 − f_h) s_h²/n_h); null when n < 2. */
  se: number | null;
  /** W_h = A_h/A. */
  weight: number;
  /** Sampling fraction f_h = n_h × plot area / A_h (0 for point plots). */
  samplingFraction: number;
}

/** A stratified estimate of a mean, with its precision when it can be estimated. */
export interface StratifiedEstimate {
  strata: StratumEstimateRow[];
  /** ȳ_st; null when a stratum with area has no observation at all. */
  mean: number | null;
  /** v(ȳ_st); null when a stratum has fewer than 2 observations. */
  variance: number | null;
  se: number | null;
  /** Satterthwaite df; null when the variance is null or zero. */
  df: number | null;
  ci95: [number, number] | null;
  /** Total basis area A, m². */
  totalBasisM2: number;
  /** Collapsed groups and the between-strata variance that replaced their strata's own (empty when none). */
  groups: CollapsedGroupVariance[];
  warnings: string[];
}

/** A collapsed group's part of v(ȳ_st). */
export interface CollapsedGroupVariance {
  strata: string[];
  /** v_g, the group's between-strata variance (units of the mean, squared). */
  variance: number;
  /** L_g − 1. */
  df: number;
}

export interface StratifiedMeanOptions {
  /** Plot footprint area in m² (for f_h); null or 0 for point plots, which means f_h = 0. */
  plotAreaM2: number | null;
  /**
   * Groups of strata (indices) whose variance is estimated together by the collapsed-strata
   * technique (see `collapseStrata`); their strata keep their own weights and means in ȳ_st.
   */
  collapsedGroups?: readonly (readonly number[])[];
}

/**
 * Stratified estimate of the mean per plot over the strata's basis area, with a 95 % CI.
 * ȳ_st = Σ W_h ȳ_h, W_h = A_h/A; v(ȳ_st) = Σ W_h² (1 − f_h) s_h²/n_h; CI ȳ_st ± t(0.975, df) √v with
 * Satterthwaite df (Cochran, Sampling Techniques, 3rd ed. 1977, eqs. 5.1, 5.13 and §5.4; equation numbers from memory).
 * Strata with n < 2 are not given a pretended variance: the SE is then null and a warning says why,
 * unless they belong to a collapsed group: then the group's terms are replaced by the between-strata
 * estimator {@link collapsedStrataVariance}, which enters the Satterthwaite df with L_g − 1 df.
 * @throws RangeError for negative areas or sizes (callers validate user input first)
 */
export function estimateStratifiedMean(
  strata: readonly StratumSummary[],
  options: StratifiedMeanOptions,
): StratifiedEstimate {
  const plotAreaM2 = options.plotAreaM2 && options.plotAreaM2 > 0 ? options.plotAreaM2 : 0;
  let totalBasisM2 = 0;
  for (const s of strata) {
    if (!(s.basisM2 >= 0) || !(s.n >= 0)) throw new RangeError(`estimateStratifiedMean: bad stratum ${s.stratum}`);
    totalBasisM2 += s.basisM2;
  }
  const warnings: string[] = [];
  if (totalBasisM2 <= 0) throw new RangeError('estimateStratifiedMean: the strata have no area');

  const rows: StratumEstimateRow[] = strata.map((s) => {
    const weight = s.basisM2 / totalBasisM2;
    const samplingFraction = plotAreaM2 > 0 && s.basisM2 > 0 ? Math.min(1, (s.n * plotAreaM2) / s.basisM2) : 0;
    const se = s.sd === null || s.n < 2 ? null : Math.sqrt(((1 - samplingFraction) * s.sd * s.sd) / s.n);
    return { stratum: s.stratum, n: s.n, mean: s.mean, sd: s.sd, se, weight, samplingFraction };
  });

  const grouped = new Set((options.collapsedGroups ?? []).flat());
  const empty = rows.filter((r) => r.weight > 0 && (r.n === 0 || r.mean === null));
  const single = rows.filter((r, i) => r.weight > 0 && r.n === 1 && !grouped.has(i));
  if (empty.length > 0) {
    warnings.push(
      `no observations in stratum ${empty.map((r) => `"${r.stratum}"`).join(', ')}: the stratified mean cannot be estimated (add data; collapsing strata supplies a variance, not a mean)`,
    );
  }
  if (single.length > 0) {
    warnings.push(
      `only one observation in stratum ${single.map((r) => `"${r.stratum}"`).join(', ')}: its variance cannot be estimated, so the SE and CI are not available (collapse strata to get them)`,
    );
  }

  const mean = empty.length > 0 ? null : rows.reduce((acc, r) => acc + (r.weight > 0 ? r.weight * (r.mean as number) : 0), 0);
  if (mean === null || single.length > 0) {
    return { strata: rows, mean, variance: null, se: null, df: null, ci95: null, totalBasisM2, groups: [], warnings };
  }

  const terms: SatterthwaiteTerm[] = rows
    .filter((r, i) => r.weight > 0 && !grouped.has(i))
    .map((r) => ({ coefficient: (r.weight * r.weight * (1 - r.samplingFraction)) / r.n, variance: (r.sd as number) ** 2, n: r.n }));
  const groups: CollapsedGroupVariance[] = [];
  for (const g of options.collapsedGroups ?? []) {
    const members = g.map((i) => rows[i]).filter((r) => r.weight > 0);
    if (members.length < 2) throw new RangeError('estimateStratifiedMean: a collapsed group needs 2 strata with area');
    const v = collapsedStrataVariance(members.map((r) => ({ weight: r.weight, mean: r.mean as number })));
    groups.push({ strata: members.map((r) => r.stratum), variance: v, df: members.length - 1 });
    terms.push({ coefficient: 1, variance: v, n: members.length });
    const w = members.map((r) => r.weight);
    if (Math.max(...w) > 2 * Math.min(...w)) {
      warnings.push(
        `the strata collapsed together (${members.map((r) => `"${r.stratum}"`).join(', ')}) differ in area by more than 2 times: the between-strata variance is then sure to be conservative only when their means differ enough, so read the SE with care`,
      );
    }
  }
  const variance = terms.reduce((acc, t) => acc + t.coefficient * t.variance, 0);
  const se = Math.sqrt(variance);
  const df = satterthwaiteDf(terms);
  const half = df === null ? 0 : tQuantile95(df) * se;
  return { strata: rows, mean, variance, se, df, ci95: [mean - half, mean + half], totalBasisM2, groups, warnings };
}

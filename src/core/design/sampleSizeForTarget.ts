import type { AllocationMethod } from '../model/designTypes';
import { allocateWithMinimum } from './allocate/allocateWithMinimum';
import { neymanWeights } from './allocate/allocateNeyman';
import type { AllocationStratum } from './allocate/allocateProportional';
import { InputError } from '../common/InputError';
import { satterthwaiteDf } from '../stats/satterthwaiteDf';
import { tQuantile95 } from '../stats/tQuantile';

/** z for a two-sided 95 % interval (standard normal 0.975 quantile; docs/references.md §7, t at ∞ df). */
export const Z_95 = 1.959963984540054;

/** What {@link sampleSizeForTarget} needs. */
export interface SampleSizeInput {
  strata: readonly AllocationStratum[];
  /** Pilot SD by stratum key (every stratum needs one). */
  sd: Readonly<Record<string, number>>;
  cost?: Readonly<Record<string, number>>;
  allocation: AllocationMethod;
  /** Target half-width d of the 95 % CI of the stratified mean, in the units of the SDs. */
  halfwidth: number;
  minPerStratum: number;
  /** Ground area of one plot in m², for the fpc (N_h = A_h / plot area); null for a point footprint: no fpc. */
  plotAreaM2: number | null;
  /**
   * Which interval the target is for: 't' (default) — the one the estimates report, t(0.975, ν) with
   * the Satterthwaite ν of the planned allocation; 'normal' — z = 1.96, the textbook approximation.
   */
  interval?: 't' | 'normal';
}

/** The smallest whole design that meets the target, and the continuous figure it started from. */
export interface SampleSizeResult {
  n: number;
  plots: number[];
  /** Continuous n from the closed formula (before the minimum rule and rounding). */
  formulaN: number;
  /** The expected 95 % half-width of the whole-number allocation, by the interval sized for. */
  halfwidth: number;
  /** Satterthwaite df of that allocation from the pilot SDs (null when the variance is 0). */
  df: number | null;
  /** The same allocation's half-width in the normal approximation (z = 1.96). */
  halfwidthNormal: number;
  interval: 't' | 'normal';
  fpcApplied: boolean;
}

/** Expected precision of the stratified mean for whole plots n_h from pilot SDs. */
export interface StratifiedPrecision {
  /** Σ W_h² (1 − f_h) S_h² / n_h. */
  variance: number;
  /** Satterthwaite ν = (Σ a_h S_h²)² / Σ (a_h S_h²)²/(n_h − 1), a_h = W_h²(1 − f_h)/n_h; null when the variance is 0 or a stratum with S_h > 0 has fewer than 2 plots. */
  df: number | null;
  /** t(0.975, ν) √v; Infinity when ν cannot be had (a stratum with S_h > 0 and fewer than 2 plots). */
  halfwidth: number;
  /** z √v, z = 1.96; Infinity when a stratum with S_h > 0 has no plot. */
  halfwidthNormal: number;
}

/**
 * Expected 95 % CI half-width of the stratified mean for whole plots n_h, both the t form the
 * estimates report (Satterthwaite df from the pilot SDs) and the normal approximation.
 * f_h = n_h / N_h (0 without an fpc). Sources: Cochran 1977, ch. 5 (variance of ȳ_st);
 * Satterthwaite 1946 (df).
 */
export function stratifiedPrecision(w: readonly number[], s: readonly number[], nh: readonly number[], bigN: readonly number[] | null): StratifiedPrecision {
  let v = 0;
  let estimable = true;
  const terms: { coefficient: number; variance: number; n: number }[] = [];
  for (let i = 0; i < w.length; i++) {
    if (s[i] === 0 || w[i] === 0) continue;
    if (nh[i] <= 0) return { variance: Number.POSITIVE_INFINITY, df: null, halfwidth: Number.POSITIVE_INFINITY, halfwidthNormal: Number.POSITIVE_INFINITY };
    const f = bigN ? Math.min(1, nh[i] / bigN[i]) : 0;
    const a = (w[i] * w[i] * (1 - f)) / nh[i];
    v += a * s[i] * s[i];
    if (nh[i] < 2) estimable = false;
    else terms.push({ coefficient: a, variance: s[i] * s[i], n: nh[i] });
  }
  const se = Math.sqrt(v);
  const df = estimable ? satterthwaiteDf(terms) : null;
  const halfwidth = !estimable ? Number.POSITIVE_INFINITY : df === null ? 0 : tQuantile95(df) * se;
  return { variance: v, df, halfwidth, halfwidthNormal: Z_95 * se };
}

/**
 * Sample size for a target half-width d of the 95 % CI of the stratified mean, under proportional,
 * equal or Neyman allocation: the continuous formula n = Σ (W_h² S_h² / w_h) / (V + Σ W_h S_h² / N),
 * V = (d/z)², w_h the allocation's share of stratum h — which gives Cochran's n0/(1 + n0/N) for
 * proportional and (Σ W_h S_h)² / (V + Σ W_h S_h²/N) for Neyman — then a search upward from it for
 * the smallest whole n whose rounded allocation (with the minimum rule) really meets d. The closed
 * formula uses z; the search uses the interval the estimates will report — t(0.975, ν) on the
 * Satterthwaite ν of each candidate allocation from the pilot SDs — so a design of that size, with
 * sample SDs equal to the pilot SDs, reports a half-width of at most d (interval 'normal' sizes in the
 * normal approximation instead, as textbooks do).
 * Source: Cochran, Sampling Techniques, 3rd ed. 1977, §5.9–5.10 (section numbers from memory) and the
 * formulas of docs/references.md §3; Satterthwaite 1946.
 * Throws InputError when an SD is missing, d is not > 0, or the target cannot be met even by
 * sampling every plot position.
 */
export function sampleSizeForTarget(input: SampleSizeInput): SampleSizeResult {
  const { strata, sd, allocation, halfwidth, minPerStratum, plotAreaM2 } = input;
  if (!(Number.isFinite(halfwidth) && halfwidth > 0)) throw new InputError(`target half-width must be a number > 0, got ${halfwidth}`);
  if (strata.length === 0) throw new InputError('there are no strata to size a sample for');
  const keys = strata.map((x) => x.key);
  const s = neymanWeights(
    strata.map((x) => ({ key: x.key, basisM2: 1 })),
    sd,
    {},
  );
  const area = strata.reduce((a, x) => a + x.basisM2, 0);
  if (!(area > 0)) throw new InputError('the strata have no area to size a sample for');
  const w = strata.map((x) => x.basisM2 / area);
  const bigN = plotAreaM2 && plotAreaM2 > 0 ? strata.map((x) => x.basisM2 / plotAreaM2) : null;
  const weights =
    allocation === 'neyman'
      ? neymanWeights(strata, sd, input.cost ?? {})
      : allocation === 'equal'
        ? strata.map(() => 1)
        : strata.map((x) => x.basisM2);
  const weightSum = weights.reduce((a, b) => a + b, 0);
  const share = weights.map((x) => (weightSum > 0 ? x / weightSum : 1 / strata.length));
  const v = (halfwidth / Z_95) ** 2;
  let numerator = 0;
  let fpcTerm = 0;
  for (let i = 0; i < strata.length; i++) {
    if (s[i] === 0 || w[i] === 0) continue;
    numerator += (w[i] * w[i] * s[i] * s[i]) / share[i];
    if (bigN) fpcTerm += (w[i] * s[i] * s[i]) / (area / plotAreaM2!);
  }
  const formulaN = numerator / (v + fpcTerm);
  const floorN = Math.max(strata.length * minPerStratum, 1);
  const totalN = bigN ? Math.floor(bigN.reduce((a, b) => a + b, 0)) : Number.POSITIVE_INFINITY;
  const limit = Math.min(totalN, 10_000_000);
  let n = Math.max(floorN, Math.floor(formulaN) - strata.length);
  const interval = input.interval ?? 't';
  for (; n <= limit; n++) {
    const { plots } = allocateWithMinimum(weights, n, minPerStratum, keys);
    const p = stratifiedPrecision(w, s, plots, bigN);
    const hw = interval === 't' ? p.halfwidth : p.halfwidthNormal;
    if (hw <= halfwidth * (1 + 1e-12)) {
      return { n, plots, formulaN, halfwidth: hw, df: p.df, halfwidthNormal: p.halfwidthNormal, interval, fpcApplied: bigN !== null };
    }
  }
  throw new InputError(
    `a 95 % half-width of ${halfwidth} cannot be reached with at most ${limit} plots; widen the target or check the pilot SDs`,
  );
}

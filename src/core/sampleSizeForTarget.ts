import type { AllocationMethod } from './designTypes';
import { allocateWithMinimum } from './allocateWithMinimum';
import { neymanWeights } from './allocateNeyman';
import type { AllocationStratum } from './allocateProportional';
import { InputError } from './InputError';

/** z for a two-sided 95 % interval (standard normal 0.975 quantile; REFERENCES.md §7, t at ∞ df). */
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
}

/** The smallest whole design that meets the target, and the continuous figure it started from. */
export interface SampleSizeResult {
  n: number;
  plots: number[];
  /** Continuous n from the closed formula (before the minimum rule and rounding). */
  formulaN: number;
  /** The real 95 % half-width of the whole-number allocation. */
  halfwidth: number;
  fpcApplied: boolean;
}

/**
 * 95 % CI half-width of the stratified mean for whole plots n_h: z · √Σ W_h² (1 − f_h) S_h² / n_h,
 * f_h = n_h / N_h (0 without an fpc). Source: Cochran 1977, ch. 5 (variance of ȳ_st; REFERENCES.md §3).
 * Returns Infinity when a stratum with S_h > 0 has no plot.
 */
export function stratifiedHalfwidth(w: readonly number[], s: readonly number[], nh: readonly number[], bigN: readonly number[] | null): number {
  let v = 0;
  for (let i = 0; i < w.length; i++) {
    if (s[i] === 0 || w[i] === 0) continue;
    if (nh[i] <= 0) return Number.POSITIVE_INFINITY;
    const f = bigN ? Math.min(1, nh[i] / bigN[i]) : 0;
    v += (w[i] * w[i] * (1 - f) * s[i] * s[i]) / nh[i];
  }
  return Z_95 * Math.sqrt(v);
}

/**
 * Sample size for a target half-width d of the 95 % CI of the stratified mean, under proportional,
 * equal or Neyman allocation: the continuous formula n = Σ (W_h² S_h² / w_h) / (V + Σ W_h S_h² / N),
 * V = (d/z)², w_h the allocation's share of stratum h — which gives Cochran's n0/(1 + n0/N) for
 * proportional and (Σ W_h S_h)² / (V + Σ W_h S_h²/N) for Neyman — then a search upward from it for
 * the smallest whole n whose rounded allocation (with the minimum rule) really meets d.
 * Source: Cochran, Sampling Techniques, 3rd ed. 1977, §5.9–5.10 (section numbers from memory) and the formulas of
 * REFERENCES.md §3.
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
  for (; n <= limit; n++) {
    const { plots } = allocateWithMinimum(weights, n, minPerStratum, keys);
    const hw = stratifiedHalfwidth(w, s, plots, bigN);
    if (hw <= halfwidth * (1 + 1e-12)) return { n, plots, formulaN, halfwidth: hw, fpcApplied: bigN !== null };
  }
  throw new InputError(
    `a 95 % half-width of ${halfwidth} cannot be reached with at most ${limit} plots; widen the target or check the pilot SDs`,
  );
}

import type { AllocationMethod } from '../model/designTypes';
import { InputError } from '../common/InputError';
import { sampleSizeForTarget } from '../design/sampleSizeForTarget';

/** What this season observed in one stratum. */
export interface ObservedStratum {
  stratum: string;
  /** Basis area (usable or mapped, as in the design), m². */
  basisM2: number;
  /** Observed SD; null when the stratum had fewer than 2 plots. */
  sd: number | null;
}

/** The plots needed under one allocation. */
export interface NextSeasonOption {
  allocation: AllocationMethod;
  n: number;
  plots: { stratum: string; plots: number }[];
  /** The 95 % half-width (t on the Satterthwaite df) this allocation reaches with these SDs, in the variable's units. */
  halfwidth: number;
  /** Its Satterthwaite df. */
  df: number | null;
  /** Continuous n from the closed formula, before rounding and the minimum rule. */
  formulaN: number;
}

export interface NextSeasonSampleSize {
  /** The absolute half-width aimed at (a relative target converted with the observed mean). */
  targetHalfwidth: number;
  proportional: NextSeasonOption;
  neyman: NextSeasonOption;
  fpcApplied: boolean;
  notes: string[];
}

export interface NextSeasonOptions {
  /** Target half-width of the 95 % CI: absolute, or relative to `observedMean` (0.1 = ±10 %). */
  target: { value: number; relative: boolean };
  /** This season's stratified mean; needed for a relative target. */
  observedMean: number | null;
  /** Plot footprint area, m², for the fpc; null/0 for point plots (no fpc). */
  plotAreaM2: number | null;
  minPerStratum?: number;
  /** SDs to use instead of the observed ones (e.g. for strata with fewer than 2 plots), by stratum. */
  sdOverride?: Readonly<Record<string, number>>;
}

/**
 * Plots needed next season for a target 95 % CI half-width of the stratified mean, from this
 * season's observed SDs, under proportional and under Neyman allocation. Delegates to the design
 * engine's {@link sampleSizeForTarget} (Cochran, Sampling Techniques, 3rd ed. 1977, §5.9–5.10 (section numbers from memory):
 * n0 = Σ W_h S_h²/V and (Σ W_h S_h)²/(V + Σ W_h S_h²/N), V = (d/z)², then the smallest whole
 * allocation that really meets d with t(0.975, ν) on the allocation's Satterthwaite ν), so a plan
 * made from these figures reproduces them and, with the same SDs, reports a CI no wider than d.
 * @throws InputError for a target that is not > 0, a relative target without a usable mean, or a
 *   stratum with no observed SD and no override
 */
export function nextSeasonSampleSize(strata: readonly ObservedStratum[], options: NextSeasonOptions): NextSeasonSampleSize {
  const { target } = options;
  if (!(target.value > 0 && Number.isFinite(target.value))) throw new InputError(`target half-width must be > 0, got ${target.value}`);
  let d = target.value;
  if (target.relative) {
    const m = options.observedMean;
    if (m === null || !(Math.abs(m) > 0)) throw new InputError('a relative target needs an observed mean other than 0');
    d = target.value * Math.abs(m);
  }
  const sd: Record<string, number> = {};
  for (const s of strata) {
    const v = options.sdOverride?.[s.stratum] ?? s.sd;
    if (v === null || !(v >= 0)) {
      throw new InputError(`stratum "${s.stratum}" has no observed SD (fewer than 2 plots): give an SD for it to size next season`);
    }
    sd[s.stratum] = v;
  }
  const alloc = strata.map((s) => ({ key: s.stratum, basisM2: s.basisM2 }));
  const minPerStratum = options.minPerStratum ?? 2;
  const one = (allocation: AllocationMethod): NextSeasonOption => {
    const r = sampleSizeForTarget({ strata: alloc, sd, allocation, halfwidth: d, minPerStratum, plotAreaM2: options.plotAreaM2 });
    return {
      allocation,
      n: r.n,
      plots: strata.map((s, i) => ({ stratum: s.stratum, plots: r.plots[i] })),
      halfwidth: r.halfwidth,
      df: r.df,
      formulaN: r.formulaN,
    };
  };
  const proportional = one('proportional');
  const neyman = one('neyman');
  const fpcApplied = options.plotAreaM2 !== null && options.plotAreaM2 > 0;
  const notes = [
    `target 95 % half-width ${Number(d.toPrecision(6))}${target.relative ? ` (${Number((target.value * 100).toPrecision(6))} % of the observed mean ${Number((options.observedMean as number).toPrecision(6))})` : ''}`,
    'sized for the t interval the estimate reports (t(0.975, ν), ν the Satterthwaite df of each allocation); the continuous formula uses z = 1.96',
    'SDs are this season’s sample SDs; a sample SD is itself uncertain, so plan a margin above these figures',
    fpcApplied ? 'finite-population correction from the plot area applied' : 'point plots: no finite-population correction',
  ];
  return { targetHalfwidth: d, proportional, neyman, fpcApplied, notes };
}

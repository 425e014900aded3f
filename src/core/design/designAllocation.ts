import { allocateBudget } from './allocate/allocateBudget';
import { allocateEqual } from './allocate/allocateEqual';
import { allocateNeyman, neymanWeights } from './allocate/allocateNeyman';
import { type AllocationStratum, allocateProportional } from './allocate/allocateProportional';
import type { AllocationResult } from './allocate/allocateWithMinimum';
import type { DesignSettings } from '../model/designTypes';
import { footprintAreaM2 } from './footprintParse';
import { limitExceeded, limitNumber, MAX_DESIGN_PLOTS } from '../common/inputLimits';
import { sampleSizeForTarget, stratifiedPrecision } from './sampleSizeForTarget';
import { roundTo } from '../common/units';

/** The expected precision of a design from its pilot SDs. */
export interface DesignPrecision {
  n: number;
  /** t(0.975, df) half-width of the 95 % CI of the stratified mean, the interval the estimates report. */
  halfwidth: number;
  df: number | null;
  /** The same in the normal approximation (z = 1.96). */
  halfwidthNormal: number;
}

/** How a random or balanced design shares its plots, and why, in words. */
export interface DesignAllocation {
  allocation: AllocationResult;
  /** Allocation weight of each stratum (shares a placement shortfall the same way). */
  weights: number[];
  statements: string[];
  /** Null unless every stratum has a pilot SD. */
  precision: DesignPrecision | null;
  /** The budget's figures when the design is sized by a budget. */
  budget: { total: number; overhead: number; plotsCost: number; formulaN: number } | null;
}

/**
 * The allocation of a random or balanced design over strata that have ground: proportional, equal
 * or Neyman for a given total; the smallest n meeting a target 95 % CI half-width (t on the
 * Satterthwaite df); or the largest n a budget with a fixed overhead pays for (Cochran's
 * cost-optimum for Neyman with costs). With a pilot SD for every stratum it also gives the expected
 * half-width at the chosen n. The design step shows the same figures before a run.
 * Sources: Cochran, Sampling Techniques, 3rd ed. 1977, ch. 5 (§5.3 proportional, §5.5 optimum and
 * budget, §5.9–5.10 sample size; section numbers from memory); Satterthwaite 1946.
 * @param strata key and basis area (m²) of each stratum with ground, in site order
 * Throws InputError from the allocation rules (missing SDs, a minimum the plots cannot meet, a
 * budget that cannot pay for it, a target that cannot be reached).
 */
export function designAllocation(strata: readonly AllocationStratum[], settings: DesignSettings): DesignAllocation {
  const keys = strata.map((s) => s.key);
  const plotArea = footprintAreaM2(settings.footprint);
  const plotAreaM2 = plotArea > 0 ? plotArea : null;
  const weights =
    settings.allocation === 'neyman'
      ? neymanWeights(strata, settings.sd, settings.cost)
      : settings.allocation === 'equal'
        ? strata.map(() => 1)
        : strata.map((s) => s.basisM2);
  const statements: string[] = [];
  let allocation: AllocationResult;
  let budget: DesignAllocation['budget'] = null;
  let sized: DesignPrecision | null = null;
  if (settings.targetHalfwidth) {
    const t = settings.targetHalfwidth;
    const d = t.relative ? t.value * (settings.pilotMean as number) : t.value;
    const size = sampleSizeForTarget({ strata, sd: settings.sd, cost: settings.cost, allocation: settings.allocation, halfwidth: d, minPerStratum: settings.minPerStratum, plotAreaM2 });
    if (size.n > MAX_DESIGN_PLOTS) {
      throw limitExceeded('target half-width', `reaching it takes ${limitNumber(size.n)} plots`, `${limitNumber(MAX_DESIGN_PLOTS)} plots in one design`);
    }
    allocation = { plots: size.plots, quotas: size.plots, raisedToMinimum: [] };
    sized = { n: size.n, halfwidth: size.halfwidth, df: size.df, halfwidthNormal: size.halfwidthNormal };
    statements.push(
      `Sample size: ${size.n} plots is the smallest design whose ${settings.allocation} allocation gives an expected 95 % CI half-width of at most ${roundTo(d, 6)} for the interval the estimates report, t(0.975) on the Satterthwaite df (expected ${roundTo(size.halfwidth, 6)} on ${size.df === null ? '–' : roundTo(size.df, 1)} df from the pilot SDs; the continuous normal-approximation formula gave ${roundTo(size.formulaN, 2)}). ` +
        (size.fpcApplied ? 'The finite-population correction uses N_h = stratum area / plot area.' : 'The footprint is a point, so no finite-population correction is applied.'),
    );
  } else if (settings.budget) {
    const costPerPlot = keys.map((k) => settings.cost[k] ?? 1);
    const b = allocateBudget({ keys, weights, costPerPlot, total: settings.budget.total, overhead: settings.budget.overhead, minPerStratum: settings.minPerStratum });
    const n = b.plots.reduce((a, v) => a + v, 0);
    if (n > MAX_DESIGN_PLOTS) throw limitExceeded('budget', `it pays for ${limitNumber(n)} plots`, `${limitNumber(MAX_DESIGN_PLOTS)} plots in one design`);
    allocation = { plots: b.plots, quotas: b.quotas, raisedToMinimum: [] };
    budget = { total: settings.budget.total, overhead: settings.budget.overhead, plotsCost: b.plotsCost, formulaN: b.formulaN };
    const rule =
      settings.allocation === 'neyman'
        ? 'the cost-optimum n_h ∝ W_h S_h/√c_h (Cochran 1977 §5.5)'
        : `${settings.allocation} shares (only Neyman allocation with costs is the cost-optimum, Cochran 1977 §5.5)`;
    statements.push(
      `Budget: ${roundTo(settings.budget.total, 2)} less a fixed overhead of ${roundTo(settings.budget.overhead, 2)} leaves ${roundTo(settings.budget.total - settings.budget.overhead, 2)} for plots at ${keys.map((k, i) => `${roundTo(costPerPlot[i], 2)} in "${k}"`).join(', ')}; ${rule} gives ${roundTo(b.formulaN, 2)} plots in real numbers, and ${b.n} whole plots cost ${roundTo(b.plotsCost, 2)}, the largest design within the budget.`,
    );
  } else if (settings.allocation === 'neyman') {
    allocation = allocateNeyman(strata, settings.sd, settings.cost, settings.plots, settings.minPerStratum);
  } else if (settings.allocation === 'equal') {
    allocation = allocateEqual(keys, settings.plots, settings.minPerStratum);
  } else {
    allocation = allocateProportional(strata, settings.plots, settings.minPerStratum);
  }
  if (allocation.raisedToMinimum.length) {
    statements.push(`Raised to the minimum of ${settings.minPerStratum} plots: ${allocation.raisedToMinimum.map((k) => `"${keys[k]}"`).join(', ')}; the other strata share the rest.`);
  }
  let precision = sized;
  if (!precision && strata.every((s) => Number.isFinite(settings.sd[s.key]))) {
    const area = strata.reduce((a, s) => a + s.basisM2, 0);
    const bigN = plotAreaM2 ? strata.map((s) => s.basisM2 / plotAreaM2) : null;
    const p = stratifiedPrecision(
      strata.map((s) => s.basisM2 / area),
      strata.map((s) => settings.sd[s.key]),
      allocation.plots,
      bigN,
    );
    const n = allocation.plots.reduce((a, b) => a + b, 0);
    precision = { n, halfwidth: p.halfwidth, df: p.df, halfwidthNormal: p.halfwidthNormal };
    statements.push(
      Number.isFinite(p.halfwidth)
        ? `Expected precision at n = ${n} from the pilot SDs: a 95 % CI half-width of ${roundTo(p.halfwidth, 6)} (t(0.975) on ${p.df === null ? '–' : roundTo(p.df, 1)} Satterthwaite df; ${roundTo(p.halfwidthNormal, 6)} in the normal approximation).`
        : `Expected precision at n = ${n}: not available, a stratum with a pilot SD above 0 has fewer than 2 plots.`,
    );
  }
  return { allocation, weights, statements, precision, budget };
}

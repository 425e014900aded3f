import { allocateWithMinimum } from './allocateWithMinimum';
import { InputError } from '../../common/InputError';

/** What {@link allocateBudget} needs, stratum by stratum in the same order. */
export interface BudgetInput {
  keys: readonly string[];
  /**
   * Allocation weights: A_h S_h/√c_h for the cost-optimum (Neyman with costs), A_h for proportional,
   * 1 for equal.
   */
  weights: readonly number[];
  /** Cost of one plot in each stratum, in the budget's units (> 0). */
  costPerPlot: readonly number[];
  /** Total budget C, including the overhead. */
  total: number;
  /** Fixed overhead c0 spent whatever the number of plots (≥ 0). */
  overhead: number;
  minPerStratum: number;
}

/** The largest whole design the budget pays for, and the real figures it comes from. */
export interface BudgetAllocation {
  n: number;
  plots: number[];
  /** Cost of the whole plots, c0 excluded: Σ n_h c_h ≤ C − c0. */
  plotsCost: number;
  /** Real n = (C − c0) / Σ_h w_h c_h (w_h the shares), and the real n_h it is shared into. */
  formulaN: number;
  quotas: number[];
}

/**
 * Allocation under a fixed budget: the cost function C = c0 + Σ n_h c_h with n_h in proportion to
 * the weights, n_h = (C − c0) · w_h / Σ_k w_k c_k. With weights A_h S_h/√c_h this is Cochran's
 * cost-optimum, n_h = (C − c0) · (W_h S_h/√c_h) / Σ W_k S_k √c_k, the allocation that minimises
 * v(ȳ_st) for the budget. Then the largest whole n whose rounded allocation (largest remainder, at
 * least `minPerStratum` in every stratum) costs no more than C − c0.
 * Source: Cochran, Sampling Techniques, 3rd ed. 1977, §5.5 (optimum allocation, eqs. 5.24–5.25;
 * numbers from memory); worked example: Valliant, Dever & Kreuter 2018, ch. 3 (docs/references.md §3).
 * @throws InputError when a cost is not > 0, the overhead is negative or not below the budget, or
 *   the budget cannot pay for the minimum number of plots in every stratum
 */
export function allocateBudget(input: BudgetInput): BudgetAllocation {
  const { keys, weights, costPerPlot, total, overhead, minPerStratum } = input;
  if (!(Number.isFinite(total) && total > 0)) throw new InputError(`the budget must be a number > 0, got ${total}`);
  if (!(Number.isFinite(overhead) && overhead >= 0)) throw new InputError(`the fixed overhead must be a number ≥ 0, got ${overhead}`);
  if (overhead >= total) throw new InputError(`the fixed overhead ${overhead} leaves nothing of the budget ${total} for plots`);
  costPerPlot.forEach((c, i) => {
    if (!(Number.isFinite(c) && c > 0)) throw new InputError(`the cost per plot of stratum "${keys[i]}" must be a number > 0, got ${c}`);
  });
  const available = total - overhead;
  const wsum = weights.reduce((a, b) => a + b, 0);
  const share = weights.map((w) => (wsum > 0 ? w / wsum : 1 / weights.length));
  const costPerUnitN = share.reduce((a, s, i) => a + s * costPerPlot[i], 0);
  const formulaN = available / costPerUnitN;
  const quotas = share.map((s) => s * formulaN);
  const costOf = (plots: readonly number[]) => plots.reduce((a, p, i) => a + p * costPerPlot[i], 0);
  const floorN = keys.length * minPerStratum;
  const minimum = allocateWithMinimum(weights, floorN, minPerStratum, keys).plots;
  if (costOf(minimum) > available * (1 + 1e-12)) {
    throw new InputError(
      `a budget of ${total} (overhead ${overhead}) cannot pay for ${minPerStratum} plots in each stratum: they cost ${costOf(minimum)} besides the overhead`,
    );
  }
  // Rounding moves each n_h by less than one plot, so no n above formulaN + Σ c_h / Σ w_h c_h can fit;
  // the cost is not monotone in n near the top, so search down from there for the largest that does.
  const top = Math.floor(formulaN + costPerPlot.reduce((a, b) => a + b, 0) / costPerUnitN) + 1;
  for (let n = Math.max(floorN, top); n >= floorN; n--) {
    const { plots } = allocateWithMinimum(weights, n, minPerStratum, keys);
    const cost = costOf(plots);
    if (cost <= available * (1 + 1e-12)) return { n, plots, plotsCost: cost, formulaN, quotas };
  }
  return { n: floorN, plots: minimum, plotsCost: costOf(minimum), formulaN, quotas };
}

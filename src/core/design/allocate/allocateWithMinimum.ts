import { allocateLargestRemainder } from './allocateLargestRemainder';
import { InputError } from '../../common/InputError';

/** An allocation: whole plots per stratum and the real quotas they were rounded from. */
export interface AllocationResult {
  plots: number[];
  /** Real quotas after the minimum rule (strata held at the minimum show exactly the minimum). */
  quotas: number[];
  /** Indices of strata raised to the minimum. */
  raisedToMinimum: number[];
}

/**
 * Shares `n` plots in proportion to `weights`, with at least `minPerStratum` plots in every stratum:
 * strata whose quota falls below the minimum are set to it and taken out, the rest is shared again
 * among the others, and so on until every quota meets the minimum; then largest-remainder rounding
 * ({@link allocateLargestRemainder}). With all weights 0 the plots are shared equally.
 * Source: Cochran, Sampling Techniques, 3rd ed. 1977, §5.5 (section number from memory; allocation, with the usual
 * adjustment when an optimum n_h is impractical).
 * @param weights non-negative weight per stratum (area, area × SD / √cost, or 1)
 * @param n total plots, a whole number
 * @param minPerStratum K, whole plots every stratum must get
 * @param keys stratum keys, for messages
 * Throws InputError when K × strata > n, or n or K is not a whole number ≥ 0.
 */
export function allocateWithMinimum(
  weights: readonly number[],
  n: number,
  minPerStratum: number,
  keys: readonly string[],
): AllocationResult {
  if (!Number.isInteger(n) || n < 0) throw new InputError(`number of plots must be a whole number ≥ 0, got ${n}`);
  if (!Number.isInteger(minPerStratum) || minPerStratum < 0) {
    throw new InputError(`minimum plots per stratum must be a whole number ≥ 0, got ${minPerStratum}`);
  }
  const h = weights.length;
  if (h === 0) throw new InputError('there are no strata to allocate plots to');
  if (minPerStratum * h > n) {
    throw new InputError(
      `the minimum of ${minPerStratum} plots in each of ${h} strata needs ${minPerStratum * h} plots, more than the ${n} asked for (${keys.join(', ')})`,
    );
  }
  for (let i = 0; i < h; i++) {
    if (!(Number.isFinite(weights[i]) && weights[i] >= 0)) {
      throw new InputError(`stratum "${keys[i]}" has an invalid allocation weight ${weights[i]}`);
    }
  }
  const fixed = new Array<boolean>(h).fill(false);
  const quotas = new Array<number>(h).fill(0);
  for (;;) {
    let freeN = n;
    let freeWeight = 0;
    let freeCount = 0;
    for (let i = 0; i < h; i++) {
      if (fixed[i]) freeN -= minPerStratum;
      else {
        freeWeight += weights[i];
        freeCount++;
      }
    }
    let changed = false;
    for (let i = 0; i < h; i++) {
      if (fixed[i]) {
        quotas[i] = minPerStratum;
        continue;
      }
      quotas[i] = freeWeight > 0 ? (freeN * weights[i]) / freeWeight : freeN / freeCount;
    }
    for (let i = 0; i < h; i++) {
      if (!fixed[i] && quotas[i] < minPerStratum - 1e-12) {
        fixed[i] = true;
        changed = true;
      }
    }
    if (!changed) break;
  }
  const raisedToMinimum: number[] = [];
  for (let i = 0; i < h; i++) if (fixed[i]) raisedToMinimum.push(i);
  return { plots: allocateLargestRemainder(quotas, n), quotas, raisedToMinimum };
}

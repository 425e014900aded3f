/** Sample size, mean, standard deviation and standard error of one stratum's observations. */
export interface StratumStats {
  n: number;
  /** null when n = 0. */
  mean: number | null;
  /** Sample SD with divisor n − 1; null when n < 2 (one value says nothing about spread). */
  sd: number | null;
  /** SD/√n, before any finite-population correction; null when n < 2. */
  se: number | null;
}

/**
 * Summary statistics of the observations in one stratum.
 * Uses Welford's one-pass update (Welford, Technometrics 4(3):419–420, 1962) so large values with a
 * small spread keep their precision; s² has divisor n − 1 (Cochran 1977, ch. 2).
 * @param values the measured values (finite numbers)
 * @throws RangeError when a value is not finite (the CSV reader rejects those first)
 */
export function stratumStats(values: readonly number[]): StratumStats {
  let mean = 0;
  let m2 = 0;
  let n = 0;
  for (const v of values) {
    if (!Number.isFinite(v)) throw new RangeError(`stratumStats: value ${v} is not a finite number`);
    n += 1;
    const d = v - mean;
    mean += d / n;
    m2 += d * (v - mean);
  }
  if (n === 0) return { n, mean: null, sd: null, se: null };
  if (n < 2) return { n, mean, sd: null, se: null };
  const sd = Math.sqrt(Math.max(0, m2) / (n - 1));
  return { n, mean, sd, se: sd / Math.sqrt(n) };
}

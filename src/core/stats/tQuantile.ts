import jstat from 'jstat';

// The default import is the CommonJS module in Node, bundlers and the browser alike; a named import
// fails under Node's own ESM loader (the scripts run with tsx).
const { jStat } = jstat;

/** Beyond this many degrees of freedom the t and normal quantiles agree to better than 1e-7. */
const NORMAL_LIMIT_DF = 1e7;

/**
 * Quantile of Student's t distribution: the x with P(T ≤ x) = p for T with `df` degrees of freedom.
 * Fractional df are allowed (Satterthwaite df usually are); `df = Infinity` gives the normal quantile.
 * @param p probability, strictly between 0 and 1
 * @param df degrees of freedom, > 0 (may be fractional or Infinity)
 * @returns the quantile, accurate to about 1e-8 (jstat's inverse incomplete beta)
 * @throws RangeError when p or df is outside its domain (a programming error, not user input)
 */
export function tQuantile(p: number, df: number): number {
  if (!(p > 0 && p < 1)) throw new RangeError(`tQuantile: p must be in (0, 1), got ${p}`);
  if (!(df > 0)) throw new RangeError(`tQuantile: df must be > 0, got ${df}`);
  if (df >= NORMAL_LIMIT_DF) return jStat.normal.inv(p, 0, 1);
  return jStat.studentt.inv(p, df);
}

/** Two-sided 95 % multiplier t(0.975, df); see {@link tQuantile}. */
export function tQuantile95(df: number): number {
  return tQuantile(0.975, df);
}

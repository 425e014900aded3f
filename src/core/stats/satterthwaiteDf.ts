/** One stratum's share of a variance: coefficient × s², from a sample of n. */
export interface SatterthwaiteTerm {
  /** Multiplier of s_h² in the variance, e.g. W_h²(1 − f_h)/n_h for a stratified mean. */
  coefficient: number;
  /** Sample variance s_h² of the stratum. */
  variance: number;
  /** Sample size n_h (≥ 2 for the term to count). */
  n: number;
}

/**
 * Satterthwaite's effective degrees of freedom of a variance estimate Σ a_h s_h²:
 * df = (Σ a_h s_h²)² / Σ (a_h s_h²)²/(n_h − 1).
 * Source: Satterthwaite, Biometrics Bulletin 2(6):110–114, 1946; Cochran, Sampling Techniques,
 * 3rd ed. 1977, §5.4 (with a_h = g_h = N_h(N_h − n_h)/n_h for a total).
 * @returns the df (fractional), or null when every term is zero (a zero variance has no df)
 * @throws RangeError when a term with a non-zero share has n < 2 (its variance is not estimable)
 */
export function satterthwaiteDf(terms: readonly SatterthwaiteTerm[]): number | null {
  // The ratio does not change when every term is scaled, so terms are divided by the largest one
  // first: squares of very small (or very large) variances would otherwise underflow to 0/0.
  let largest = 0;
  for (const t of terms) {
    const part = Math.abs(t.coefficient * t.variance);
    if (part === 0) continue;
    if (t.n < 2) throw new RangeError(`satterthwaiteDf: a term with n = ${t.n} has no variance estimate`);
    if (part > largest) largest = part;
  }
  if (largest === 0) return null;
  let sum = 0;
  let sumSq = 0;
  for (const t of terms) {
    const part = (t.coefficient * t.variance) / largest;
    if (part === 0) continue;
    sum += part;
    sumSq += (part * part) / (t.n - 1);
  }
  if (sum === 0) return null;
  return (sum * sum) / sumSq;
}

/** The design effect of a stratified estimate and the SRS variance it is compared with. */
export interface DesignEffect {
  /** v_st / v_srs; null when either variance is unavailable or v_srs is 0. */
  deff: number | null;
  /** v_srs = (1 − f) s²/n with s² the variance of all n values pooled, f = n a / A. */
  srsVariance: number | null;
  formula: string;
}

export interface DesignEffectOptions {
  /** Plot footprint area, m²; null or 0 for point plots (then f = 0). */
  plotAreaM2: number | null;
  /** Total basis area A, m². */
  totalBasisM2: number;
}

/** The wording of the comparison, for reports. */
export const DESIGN_EFFECT_FORMULA =
  'deff = v(ȳ_st) / v_srs, v_srs = (1 − f) s²/n with s² the sample variance of all n plots pooled (divisor n − 1) and f = n·a/A';

/**
 * Design effect of a stratified mean against a simple random sample of the same n (Kish, Survey
 * Sampling, 1965, §8.2, section number from memory): deff = v(ȳ_st)/v_srs, v_srs = (1 − f) s²/n, s² from all values pooled
 * ignoring strata. Below 1 means the stratification paid off. The pooled s² is itself a
 * stratified-sample statistic, so this is the usual approximation, not an exact SRS variance.
 * @param stratifiedVariance v(ȳ_st), or null when it could not be estimated
 * @param values every observation used in the estimate
 */
export function designEffect(
  stratifiedVariance: number | null,
  values: readonly number[],
  options: DesignEffectOptions,
): DesignEffect {
  const n = values.length;
  if (n < 2) return { deff: null, srsVariance: null, formula: DESIGN_EFFECT_FORMULA };
  let mean = 0;
  let m2 = 0;
  let k = 0;
  for (const v of values) {
    k += 1;
    const d = v - mean;
    mean += d / k;
    m2 += d * (v - mean);
  }
  const s2 = m2 / (n - 1);
  const a = options.plotAreaM2 && options.plotAreaM2 > 0 ? options.plotAreaM2 : 0;
  const f = a > 0 && options.totalBasisM2 > 0 ? Math.min(1, (n * a) / options.totalBasisM2) : 0;
  const srsVariance = ((1 - f) * s2) / n;
  const deff = stratifiedVariance === null || srsVariance === 0 ? null : stratifiedVariance / srsVariance;
  return { deff, srsVariance, formula: DESIGN_EFFECT_FORMULA };
}

import { InputError } from '../common/InputError';
import { tQuantile95 } from '../stats/tQuantile';
import { M2_PER_HA } from '../common/units';

/** Standard normal 0.975 quantile (t at infinite df). */
const Z_95 = tQuantile95(Number.POSITIVE_INFINITY);

/** Counts from a two-session mark–recapture survey. */
export interface RecaptureCounts {
  /** M: animals marked and released in the first session. */
  marked: number;
  /** n: animals caught in the second session. */
  caught: number;
  /** m: marked animals among those caught in the second session. */
  recaptured: number;
}

/** Abundance estimates and, when an effective area is given, density. */
export interface RecaptureEstimate {
  /** Lincoln–Petersen N̂ = Mn/m; null when m = 0 (no finite estimate). */
  petersen: number | null;
  /** Chapman N* = (M+1)(n+1)/(m+1) − 1. */
  chapman: number;
  /** Seber's variance of N*: (M+1)(n+1)(M−m)(n−m)/[(m+1)²(m+2)]. */
  variance: number;
  se: number;
  /** Normal-approximation 95 % CI, N* ± 1.96 SE, the lower end raised to the animals actually seen. */
  ci95: [number, number];
  /** M + n − m: distinct animals handled, a hard lower bound. */
  knownMinimum: number;
  density: { effectiveAreaHa: number; perHa: number; sePerHa: number; ci95PerHa: [number, number] } | null;
  warnings: string[];
  assumptions: string[];
}

/** Assumptions every two-sample estimate rests on (Seber 1982, ch. 3; Krebs 1989, ch. 2). */
export const RECAPTURE_ASSUMPTIONS = [
  'the population is closed between the sessions: no births, deaths, immigration or emigration',
  'marks are not lost, and are recognised when a marked animal is caught again',
  'marking does not change an animal’s chance of being caught or of surviving',
  'in the second session, marked and unmarked animals are equally likely to be caught',
  'the boundary strip width is an assumption about how far animals range beyond the grid; density depends on it',
];

/**
 * Two-sample (Lincoln–Petersen) abundance with Chapman's nearly unbiased form and Seber's
 * variance: N* = (M+1)(n+1)/(m+1) − 1, v = (M+1)(n+1)(M−m)(n−m)/[(m+1)²(m+2)], 95 % CI N* ± 1.96√v.
 * Density divides by an effective area (e.g. from {@link recaptureEffectiveAreaHa}), taken as known.
 * Source: Seber, The Estimation of Animal Abundance, 2nd ed. 1982, ch. 3; Chapman 1951.
 * Warns when m < 7, below which Chapman's estimator is no longer nearly unbiased and the normal CI
 * is poor (Robson & Regier 1964, cited by Seber 1982 and Krebs 1989).
 * @throws InputError when a count is not a whole number ≥ 0, M or n is 0, or m exceeds M or n
 */
export function recaptureEstimate(counts: RecaptureCounts, options: { effectiveAreaHa?: number } = {}): RecaptureEstimate {
  const { marked: M, caught: n, recaptured: m } = counts;
  for (const [name, v] of [
    ['marked', M],
    ['caught', n],
    ['recaptured', m],
  ] as const) {
    if (!Number.isInteger(v) || v < 0) throw new InputError(`${name} must be a whole number ≥ 0, got ${v}`);
  }
  if (M === 0) throw new InputError('marked must be at least 1: with no marked animals there is nothing to recapture');
  if (n === 0) throw new InputError('caught must be at least 1: the second session caught nothing');
  if (m > n) throw new InputError(`recaptured (${m}) cannot exceed caught (${n})`);
  if (m > M) throw new InputError(`recaptured (${m}) cannot exceed marked (${M})`);
  const area = options.effectiveAreaHa;
  if (area !== undefined && !(area > 0 && Number.isFinite(area))) throw new InputError(`effective area must be > 0 ha, got ${area}`);

  const petersen = m === 0 ? null : (M * n) / m;
  const chapman = ((M + 1) * (n + 1)) / (m + 1) - 1;
  const variance = ((M + 1) * (n + 1) * (M - m) * (n - m)) / ((m + 1) ** 2 * (m + 2));
  const se = Math.sqrt(variance);
  const knownMinimum = M + n - m;
  const ci95: [number, number] = [Math.max(knownMinimum, chapman - Z_95 * se), chapman + Z_95 * se];
  const warnings: string[] = [];
  if (m < 7) {
    warnings.push(
      `only ${m} recapture${m === 1 ? '' : 's'} (fewer than 7): the estimate may be biased and the normal-approximation CI is unreliable; catch more animals in the second session if you can`,
    );
  }
  if (m === 0) warnings.push('no marked animal was recaptured: the Petersen estimate is infinite and Chapman’s is only a rough lower guide');
  if (m === n && m > 0) warnings.push('every animal caught in the second session was marked: the population may be little larger than the animals already seen');
  const density =
    area === undefined
      ? null
      : { effectiveAreaHa: area, perHa: chapman / area, sePerHa: se / area, ci95PerHa: [ci95[0] / area, ci95[1] / area] as [number, number] };
  return { petersen, chapman, variance, se, ci95, knownMinimum, density, warnings, assumptions: RECAPTURE_ASSUMPTIONS };
}

/**
 * Effective trapping area, ha: the grid's extent plus a boundary strip of width W all round, with
 * rounded corners: A = L1·L2 + 2W(L1 + L2) + πW² (the usual strip method, e.g. Krebs 1989 ch. 2;
 * W is often taken as half the mean maximum distance moved — common practice). For a grid of
 * `rows` × `cols` stations `spacingM` apart, L1 = (rows − 1)s and L2 = (cols − 1)s; given only the
 * grid's area, the grid is taken as a square of that area.
 * @throws InputError for a negative strip, a non-positive spacing or area, or fewer than 1 row/column
 */
export function recaptureEffectiveAreaHa(
  grid: { areaHa: number } | { spacingM: number; rows: number; cols: number },
  stripM: number,
): number {
  if (!(stripM >= 0 && Number.isFinite(stripM))) throw new InputError(`strip width must be ≥ 0 m, got ${stripM}`);
  let l1: number;
  let l2: number;
  if ('areaHa' in grid) {
    if (!(grid.areaHa > 0 && Number.isFinite(grid.areaHa))) throw new InputError(`grid area must be > 0 ha, got ${grid.areaHa}`);
    l1 = l2 = Math.sqrt(grid.areaHa * M2_PER_HA);
  } else {
    if (!(grid.spacingM > 0 && Number.isFinite(grid.spacingM))) throw new InputError(`grid spacing must be > 0 m, got ${grid.spacingM}`);
    for (const [name, v] of [
      ['rows', grid.rows],
      ['columns', grid.cols],
    ] as const) {
      if (!Number.isInteger(v) || v < 1) throw new InputError(`${name} must be a whole number ≥ 1, got ${v}`);
    }
    l1 = (grid.rows - 1) * grid.spacingM;
    l2 = (grid.cols - 1) * grid.spacingM;
  }
  const areaM2 = l1 * l2 + 2 * stripM * (l1 + l2) + Math.PI * stripM * stripM;
  if (!(areaM2 > 0)) throw new InputError('the effective area is 0: a single station needs a boundary strip wider than 0 m');
  return areaM2 / M2_PER_HA;
}

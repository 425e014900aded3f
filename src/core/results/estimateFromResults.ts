import { COLLAPSE_RULE, collapseStrata } from './collapseStrata';
import { DESIGN_EFFECT_FORMULA, designEffect } from './designEffect';
import type { PlotCollection } from '../model/designTypes';
import { estimateStratifiedMean, type StratifiedEstimate } from './estimateStratifiedMean';
import { estimateStratifiedProportion } from './estimateStratifiedProportion';
import { estimateTotal } from './estimateTotal';
import { footprintAreaM2 } from '../design/footprintParse';
import { InputError } from '../common/InputError';
import type { ResultKind } from '../model/designTypes';
import { type ResultsTable, resultsReview } from './resultsCheck';
import { stratumStats } from './stratumStats';
import { M2_PER_HA } from '../common/units';

/** One stratum's line of the estimate report. */
export interface EstimateStratumRow {
  stratum: string;
  n: number;
  mean: number | null;
  sd: number | null;
  se: number | null;
  weight: number;
  basis_m2: number;
  sampling_fraction: number;
  /** The collapsed group whose between-strata variance stands for this stratum's own; null when not collapsed. */
  group: string[] | null;
}

/** A group of strata collapsed for the variance. */
export interface EstimateCollapsedGroup {
  strata: string[];
  /** The group's between-strata variance of its share of the mean, and its df (strata − 1). */
  variance: number;
  df: number;
  /** SD of all the group's plots pooled: a planning value for next season, not used in the estimate. */
  pooled_sd: number | null;
}

/** Everything `stratplot estimate` reports. */
export interface EstimateReport {
  variable: string;
  kind: ResultKind;
  strata: EstimateStratumRow[];
  mean: number | null;
  se: number | null;
  ci95: [number, number] | null;
  df: number | null;
  total: number | null;
  total_ci95: [number, number] | null;
  deff: number | null;
  total_se: number | null;
  total_unit: string | null;
  area_ha: number;
  share_basis: 'usable' | 'mapped';
  plot_area_m2: number;
  /** One line per collapsed group, e.g. "Eucalypt woodland (n = 13) + Wet meadow (n = 1)". */
  collapsed: string[];
  collapsed_groups: EstimateCollapsedGroup[];
  warnings: string[];
  formulas: string[];
  population: string;
}

export interface EstimateOptions {
  value: string;
  kind: ResultKind;
  collapse: boolean;
  /** The value is already a density per hectare (totals are then density × ha). */
  perHa?: boolean;
}

const FORMULAS = [
  'stratified mean ȳ_st = Σ W_h ȳ_h with W_h = A_h/A (A_h the basis area of stratum h) — Cochran 1977 ch. 5',
  'v(ȳ_st) = Σ W_h² (1 − f_h) s_h²/n_h, f_h = n_h × plot area / A_h — Cochran 1977 ch. 5',
  '95 % CI ȳ_st ± t(0.975, df) √v with Satterthwaite df = (Σ g_h s_h²)² / Σ (g_h s_h²)²/(n_h − 1), g_h = W_h²(1 − f_h)/n_h — Satterthwaite 1946; Cochran 1977 ch. 5',
  'proportions: v(p_st) = Σ W_h² (1 − f_h) p_h(1 − p_h)/(n_h − 1) — Cochran 1977 ch. 5',
  'total = density per ha × basis area in ha; its SE and CI are the mean’s scaled by the same constant — Cochran 1977 ch. 5',
  DESIGN_EFFECT_FORMULA,
];

const COLLAPSED_FORMULA =
  'collapsed strata: ȳ_st keeps every stratum; the terms of a group of L strata are replaced by v_g = L/(L − 1) Σ_h (W_h ȳ_h − (W_h/W_g) Σ_k W_k ȳ_k)², W_g = Σ W_h, with L − 1 df in the Satterthwaite df — conservative; Hansen, Hurwitz & Madow 1953; Cochran 1977 §5A.12';

/** What the total of each kind of variable means and how per-plot values are scaled to it. */
function totalScale(kind: ResultKind, plotAreaM2: number, perHa: boolean): { plotAreaM2: number | null; unit: string; factor: number } | null {
  if (kind === 'cover') return { plotAreaM2: null, unit: 'ha covered', factor: 0.01 };
  if (kind === 'presence') return { plotAreaM2: null, unit: 'ha occupied (area where present)', factor: 1 };
  if (perHa) return { plotAreaM2: null, unit: 'total over the area (value per ha × ha)', factor: 1 };
  if (plotAreaM2 > 0) return { plotAreaM2, unit: 'total over the area (per-plot value / plot area × area)', factor: 1 };
  return null;
}

/**
 * Stratified estimate of one results variable from a plot file and a results table: checks the
 * results (errors stop it), groups measurements by stratum in the design's order, optionally
 * collapses strata with one plot for the variance (the mean keeps every stratum), and returns mean, SE, 95 % CI, Satterthwaite df, total
 * with CI, design effect, warnings and the formulas used (Cochran, Sampling Techniques, 3rd ed.
 * 1977, ch. 5). Weights use each stratum's usable area, or its mapped area when the design's
 * share basis is 'mapped'.
 * @throws InputError naming file, row and column for the first error found in the results, or
 *   for a plot file whose strata are missing from its allocation table
 */
export function estimateFromResults(plots: PlotCollection, table: ResultsTable, options: EstimateOptions): EstimateReport {
  const design = plots.design;
  const shareBasis = design.settings.shareBasis === 'mapped' ? 'mapped' : 'usable';
  const review = resultsReview(plots, table, { column: options.value, kind: options.kind });
  const errors = review.problems.filter((p) => p.severity === 'error');
  if (errors.length > 0) {
    const more = errors.length > 1 ? ` (and ${errors.length - 1} more problem${errors.length > 2 ? 's' : ''})` : '';
    throw new InputError(`${errors[0].message}${more}`);
  }
  const warnings = review.problems.map((p) => p.message);
  const groups = design.allocation.map((r) => ({ stratum: r.stratum, basisM2: shareBasis === 'mapped' ? r.mapped_m2 : r.usable_m2, values: [] as number[] }));
  const byStratum = new Map(groups.map((g) => [g.stratum, g]));
  for (const o of review.observations) {
    const s = byStratum.get(o.stratum);
    if (!s) throw new InputError(`plot ${o.plotId} belongs to stratum "${o.stratum}", which is not in the plot file's allocation table`);
    s.values.push(o.value);
  }
  const collapse = options.collapse ? collapseStrata(groups.map((g) => ({ stratum: g.stratum, n: g.values.length }))) : { groups: [], merged: [] };
  const collapsed = collapse.merged;
  if (collapsed.length > 0) warnings.push(`strata collapsed for the variance: ${collapsed.join('; ')}. Rule: ${COLLAPSE_RULE}`);
  const groupOf = new Map<string, string[]>();
  for (const g of collapse.groups) for (const k of g.strata) groupOf.set(k, g.strata);
  const plotAreaM2 = footprintAreaM2(design.settings.footprint);
  if (plotAreaM2 === 0) warnings.push('plots are points (no footprint area): sampling fractions are 0, no finite-population correction is applied');
  const stats = groups.map((g) => ({ g, s: stratumStats(g.values) }));
  const collapsedGroups = collapse.groups.map((g) => g.indices);
  const est: StratifiedEstimate =
    options.kind === 'presence'
      ? estimateStratifiedProportion(
          stats.map(({ g, s }) => ({ stratum: g.stratum, basisM2: g.basisM2, n: s.n, present: g.values.reduce((a, b) => a + b, 0) })),
          { plotAreaM2, collapsedGroups },
        )
      : estimateStratifiedMean(
          stats.map(({ g, s }) => ({ stratum: g.stratum, basisM2: g.basisM2, n: s.n, mean: s.mean, sd: s.sd })),
          { plotAreaM2, collapsedGroups },
        );
  warnings.push(...est.warnings);
  const collapsedOut: EstimateCollapsedGroup[] = collapse.groups.map((g) => {
    const found = est.groups.find((x) => x.strata.join('\u0000') === g.strata.join('\u0000'));
    return {
      strata: g.strata,
      variance: found?.variance ?? Number.NaN,
      df: g.strata.length - 1,
      pooled_sd: stratumStats(g.indices.flatMap((i) => groups[i].values)).sd,
    };
  });
  const deff = designEffect(est.variance, review.observations.map((o) => o.value), { plotAreaM2, totalBasisM2: est.totalBasisM2 });
  const scale = totalScale(options.kind, plotAreaM2, options.perHa === true);
  const tot = scale ? estimateTotal(est, { plotAreaM2: scale.plotAreaM2 }) : null;
  if (!scale) warnings.push('no total: the plots are points, so a per-plot value has no area to scale by (give --per-ha if the values are densities per ha)');
  const f = scale?.factor ?? 1;
  const areaHa = est.totalBasisM2 / M2_PER_HA;
  return {
    variable: options.value,
    kind: options.kind,
    strata: est.strata.map((r, i) => ({
      stratum: r.stratum,
      n: r.n,
      mean: r.mean,
      sd: r.sd,
      se: r.se,
      weight: r.weight,
      basis_m2: groups[i].basisM2,
      sampling_fraction: r.samplingFraction,
      group: groupOf.get(r.stratum) ?? null,
    })),
    mean: est.mean,
    se: est.se,
    ci95: est.ci95,
    df: est.df,
    total: tot?.total == null ? null : tot.total * f,
    total_ci95: tot?.total_ci95 == null ? null : [tot.total_ci95[0] * f, tot.total_ci95[1] * f],
    deff: deff.deff,
    total_se: tot?.totalSe == null ? null : tot.totalSe * f,
    total_unit: scale?.unit ?? null,
    area_ha: areaHa,
    share_basis: shareBasis,
    plot_area_m2: plotAreaM2,
    collapsed,
    collapsed_groups: collapsedOut,
    warnings,
    formulas: collapsed.length > 0 ? [...FORMULAS, COLLAPSED_FORMULA] : FORMULAS,
    population:
      shareBasis === 'usable'
        ? `Estimates cover the usable area of the strata (${areaHa.toFixed(2)} ha). Ground inside buffered exclusions (cliffs, water, private land, hazards) is outside the population: nothing is estimated for it.`
        : `Weights use the mapped stratum areas (${areaHa.toFixed(2)} ha, the design's share basis), but plots lie only on usable ground: the estimates describe the usable area, and totals over the mapped area assume the excluded ground is like the usable ground.`,
  };
}

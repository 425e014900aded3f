import { COLLAPSE_RULE, collapseStrata, type StratumValues } from './collapseStrata';
import { DESIGN_EFFECT_FORMULA, designEffect } from './designEffect';
import type { PlotCollection } from './designTypes';
import { estimateStratifiedMean, type StratifiedEstimate } from './estimateStratifiedMean';
import { estimateStratifiedProportion } from './estimateStratifiedProportion';
import { estimateTotal } from './estimateTotal';
import { footprintAreaM2 } from './footprintParse';
import { InputError } from './InputError';
import type { ResultKind } from './resultsCellParse';
import { type ResultsTable, resultsReview } from './resultsCheck';
import { stratumStats } from './stratumStats';

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
  /** Strata merged into this one when strata were collapsed. */
  members: string[];
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
  collapsed: string[];
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
 * collapses strata with fewer than 2 plots, and returns mean, SE, 95 % CI, Satterthwaite df, total
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
  const order = design.allocation.map((r) => r.stratum);
  const byStratum = new Map<string, StratumValues>();
  for (const r of design.allocation) {
    byStratum.set(r.stratum, { stratum: r.stratum, basisM2: shareBasis === 'mapped' ? r.mapped_m2 : r.usable_m2, values: [] });
  }
  for (const o of review.observations) {
    const s = byStratum.get(o.stratum);
    if (!s) throw new InputError(`plot ${o.plotId} belongs to stratum "${o.stratum}", which is not in the plot file's allocation table`);
    s.values.push(o.value);
  }
  let groups = order.map((k) => byStratum.get(k) as StratumValues);
  let collapsed: string[] = [];
  if (options.collapse) {
    const c = collapseStrata(groups);
    groups = c.strata;
    collapsed = c.merged;
    if (collapsed.length > 0) warnings.push(`strata collapsed: ${collapsed.join('; ')}. Rule: ${COLLAPSE_RULE}`);
  }
  const plotAreaM2 = footprintAreaM2(design.settings.footprint);
  if (plotAreaM2 === 0) warnings.push('plots are points (no footprint area): sampling fractions are 0, no finite-population correction is applied');
  const stats = groups.map((g) => ({ g, s: stratumStats(g.values) }));
  const est: StratifiedEstimate =
    options.kind === 'presence'
      ? estimateStratifiedProportion(
          stats.map(({ g, s }) => ({ stratum: g.stratum, basisM2: g.basisM2, n: s.n, present: g.values.reduce((a, b) => a + b, 0) })),
          { plotAreaM2 },
        )
      : estimateStratifiedMean(
          stats.map(({ g, s }) => ({ stratum: g.stratum, basisM2: g.basisM2, n: s.n, mean: s.mean, sd: s.sd })),
          { plotAreaM2 },
        );
  warnings.push(...est.warnings);
  const deff = designEffect(est.variance, review.observations.map((o) => o.value), { plotAreaM2, totalBasisM2: est.totalBasisM2 });
  const scale = totalScale(options.kind, plotAreaM2, options.perHa === true);
  const tot = scale ? estimateTotal(est, { plotAreaM2: scale.plotAreaM2 }) : null;
  if (!scale) warnings.push('no total: the plots are points, so a per-plot value has no area to scale by (give --per-ha if the values are densities per ha)');
  const f = scale?.factor ?? 1;
  const areaHa = est.totalBasisM2 / 10_000;
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
      members: groups[i].members ?? [r.stratum],
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
    warnings,
    formulas: FORMULAS,
    population:
      shareBasis === 'usable'
        ? `Estimates cover the usable area of the strata (${areaHa.toFixed(2)} ha). Ground inside buffered exclusions (cliffs, water, private land, hazards) is outside the population: nothing is estimated for it.`
        : `Weights use the mapped stratum areas (${areaHa.toFixed(2)} ha, the design's share basis), but plots lie only on usable ground: the estimates describe the usable area, and totals over the mapped area assume the excluded ground is like the usable ground.`,
  };
}

import type { EstimateReport } from '../../core/results/estimateFromResults';
import type { NextSeasonSampleSize } from '../../core/results/nextSeasonSampleSize';
import type { RecaptureEstimate } from '../../core/results/recapture';
import type { ReportTable } from '../pdf/designReportPdf';

/** Significant-looking but short: 4 significant digits, plain notation for ordinary sizes. */
function num(v: number | null | undefined, digits = 4): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  if (v === 0) return '0';
  const a = Math.abs(v);
  if (a >= 1e-3 && a < 1e7) return String(Number(v.toPrecision(digits)));
  return v.toExponential(digits - 1);
}

function ci(pair: [number, number] | null): string {
  return pair ? `${num(pair[0])} to ${num(pair[1])}` : '—';
}

/**
 * Turns a stratified estimate (and optionally next season's sizes and recapture grids) into the
 * `estimates` tables of the design report (designReportPdf): one table per stratum row plus the
 * stratified line, with the population statement, warnings and formulas as notes.
 * @param recaptures named grids with their estimates (Seber 1982 ch. 3 formulas, from core/recapture)
 */
export function designReportEstimates(
  report: EstimateReport,
  next?: NextSeasonSampleSize | null,
  recaptures: readonly { name: string; estimate: RecaptureEstimate }[] = [],
): ReportTable[] {
  const n = report.strata.reduce((a, s) => a + s.n, 0);
  const rows: (string | number)[][] = report.strata.map((s) => [s.group ? `${s.stratum} (collapsed)` : s.stratum, s.n, num(s.mean), num(s.sd), num(s.se), num(s.weight, 3)]);
  rows.push([`Stratified (${report.area_ha.toFixed(2)} ha)`, n, num(report.mean), '', num(report.se), '1']);
  const tables: ReportTable[] = [
    {
      title: `Estimate of ${report.variable} (${report.kind})`,
      head: ['Stratum', 'n', 'Mean', 'SD', 'SE', 'Weight'],
      rows,
      notes: [
        `95 % CI of the mean ${ci(report.ci95)}, Satterthwaite df ${report.df === null ? '—' : report.df.toFixed(1)}; design effect ${num(report.deff, 3)}.`,
        ...(report.total_unit ? [`Total ${num(report.total)} (${report.total_unit}), 95 % CI ${ci(report.total_ci95)}.`] : []),
        ...report.collapsed_groups.map(
          (g) =>
            `Collapsed for the variance: ${g.strata.join(' + ')} — between-strata variance ${num(g.variance)} on ${g.df} df (Hansen, Hurwitz & Madow 1953; Cochran 1977 §5A.12). The mean keeps every stratum; the variance is conservative (the SE tends to be too large rather than too small).`,
        ),
        report.population,
        ...report.warnings.map((w) => `Warning: ${w}`),
        ...report.formulas.map((f) => `Formula: ${f}`),
      ],
    },
  ];
  if (next) {
    tables.push({
      title: `Next season: plots for a 95 % CI half-width of ${num(next.targetHalfwidth)}`,
      head: ['Allocation', 'Plots', ...next.proportional.plots.map((p) => p.stratum)],
      rows: [next.proportional, next.neyman].map((o) => [o.allocation, o.n, ...o.plots.map((p) => p.plots)]),
      notes: next.notes,
    });
  }
  if (recaptures.length) {
    tables.push({
      title: 'Mark–recapture by trapping grid',
      head: ['Grid', 'Petersen', 'Chapman', 'SE', '95 % CI', 'Per ha'],
      rows: recaptures.map(({ name, estimate: e }) => [name, num(e.petersen), num(e.chapman), num(e.se), ci(e.ci95), e.density ? `${num(e.density.perHa)} (${ci(e.density.ci95PerHa)})` : '—']),
      notes: [...recaptures.flatMap(({ name, estimate }) => estimate.warnings.map((w) => `${name}: ${w}`)), ...(recaptures[0]?.estimate.assumptions.map((a) => `Assumes ${a}.`) ?? [])],
    });
  }
  return tables;
}

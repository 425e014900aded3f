import type { EstimateReport } from '../../core/results/estimateFromResults';
import { isFormulaStart } from '../common/csvCell';
import { M2_PER_HA } from '../../core/common/units';

export interface EstimatesCsvOptions {
  /** ',' (default) or ';' — use ';' with decimal commas, as spreadsheets in many locales expect. */
  delimiter?: ',' | ';';
  decimal?: '.' | ',';
}

const COLUMNS = [
  'level',
  'stratum',
  'n',
  'mean',
  'sd',
  'se',
  'ci95_low',
  'ci95_high',
  'df',
  'weight',
  'basis_ha',
  'sampling_fraction',
  'total',
  'total_ci95_low',
  'total_ci95_high',
  'deff',
] as const;

/**
 * Writes an estimate report as CSV for spreadsheets: one row per stratum, an "all" row with the
 * stratified mean, CI, df, total and design effect, then "note" rows with the population statement,
 * warnings and formulas. Numbers are written in full precision with the chosen decimal mark; empty
 * cells mean "not available". Text cells are quoted when needed (RFC 4180) and text starting with
 * = + - @ (or their full-width forms, see csvCell) is prefixed with ' so spreadsheets do not run it as a formula.
 */
export function estimatesToCsv(report: EstimateReport, options: EstimatesCsvOptions = {}): string {
  const delimiter = options.delimiter ?? ',';
  const decimal = options.decimal ?? (delimiter === ';' ? ',' : '.');
  const num = (v: number | null | undefined) => (v === null || v === undefined ? '' : decimal === ',' ? String(v).replace('.', ',') : String(v));
  const text = (v: string) => {
    const safe = isFormulaStart(v) ? `'${v}` : v;
    return /["\r\n]/.test(safe) || safe.includes(delimiter) ? `"${safe.replace(/"/g, '""')}"` : safe;
  };
  const line = (cells: Partial<Record<(typeof COLUMNS)[number], string>>) => COLUMNS.map((c) => cells[c] ?? '').join(delimiter);
  const out = [COLUMNS.join(delimiter)];
  for (const s of report.strata) {
    out.push(
      line({
        level: 'stratum',
        stratum: text(s.stratum),
        n: num(s.n),
        mean: num(s.mean),
        sd: num(s.sd),
        se: num(s.se),
        weight: num(s.weight),
        basis_ha: num(s.basis_m2 / M2_PER_HA),
        sampling_fraction: num(s.sampling_fraction),
      }),
    );
  }
  out.push(
    line({
      level: 'all',
      stratum: text(`${report.variable} (all strata)`),
      n: num(report.strata.reduce((a, s) => a + s.n, 0)),
      mean: num(report.mean),
      se: num(report.se),
      ci95_low: num(report.ci95?.[0]),
      ci95_high: num(report.ci95?.[1]),
      df: num(report.df),
      weight: num(1),
      basis_ha: num(report.area_ha),
      total: num(report.total),
      total_ci95_low: num(report.total_ci95?.[0]),
      total_ci95_high: num(report.total_ci95?.[1]),
      deff: num(report.deff),
    }),
  );
  for (const note of [report.population, ...report.warnings, ...report.formulas]) out.push(line({ level: 'note', stratum: text(note) }));
  return `${out.join('\r\n')}\r\n`;
}

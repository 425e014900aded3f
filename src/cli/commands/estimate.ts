import { writeFile } from 'node:fs/promises';
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { COLLAPSE_RULE } from '../../core/results/collapseStrata';
import { type EstimateReport, estimateFromResults } from '../../core/results/estimateFromResults';
import { InputError, isInputError } from '../../core/common/InputError';
import { type NextSeasonSampleSize, nextSeasonSampleSize } from '../../core/results/nextSeasonSampleSize';
import { resultsKindGuess } from '../../core/results/resultsCellParse';
import { RESULT_KINDS, type ResultKind } from '../../core/model/designTypes';
import { estimatesToCsv } from '../../io/results/estimatesToCsv';
import { parsePlotFile } from '../../io/plots/parsePlotFile';
import { parseResultsCsv } from '../../io/results/parseResultsCsv';
import type { CliIo, Command } from '../command';
import { optionNumber } from '../optionNumber';
import { readInputFile } from '../readInput';

const USAGE = `stratplot estimate <plots-file> <results.csv> --value FIELD [options]

Stratified estimates (mean, SE, 95 % CI, total, design effect) of one field measurement, from the
plot file written by \`stratplot plan\` and a results table exported from a spreadsheet.

Options:
  --value FIELD        results column to estimate (required)
  --id-column NAME     column holding plot ids (default plot_id)
  --kind KIND          measure | cover | count | presence (default: guessed from the column)
  --per-ha             the values are already densities per ha (totals = value × ha)
  --collapse           estimate the variance of strata with one plot by collapsing them with a
                       neighbour (between-strata estimator, conservative); the mean keeps them all
  --next-halfwidth X[%]
                       also size next season's sample for a 95 % CI half-width X (absolute,
                       or with % relative to this season's mean), under proportional and Neyman
                       allocation from the observed SDs
  --out FILE.csv       also write the estimates as CSV (semicolons and decimal commas when the
                       results file used them)
  --json               print the estimate as JSON

The results table: comma, semicolon or tab separated, UTF-8 (with or without BOM), decimal point or
comma; optional columns "status" (done | rejected) and "replaced_by" (the reserve used instead).
Collapse rule: ${COLLAPSE_RULE}.`;

const f = (v: number | null, digits = 4) => (v === null ? 'n/a' : v.toFixed(digits));

function printTable(r: EstimateReport, io: CliIo): void {
  const head = ['stratum', 'n', 'mean', 'sd', 'se', 'weight'];
  const rows = r.strata.map((s) => [s.stratum, String(s.n), f(s.mean), f(s.sd), f(s.se), s.weight.toFixed(4)]);
  const widths = head.map((h, j) => Math.max(h.length, ...rows.map((x) => x[j].length)));
  const fmt = (cells: string[]) => cells.map((c, j) => (j === 0 ? c.padEnd(widths[j]) : c.padStart(widths[j]))).join('  ');
  const lines = [`Stratified estimate of ${r.variable} (${r.kind})`, '', fmt(head), ...rows.map(fmt), ''];
  lines.push(`mean   ${f(r.mean)}   SE ${f(r.se)}   95 % CI ${r.ci95 ? `${f(r.ci95[0])} to ${f(r.ci95[1])}` : 'n/a'}   df ${f(r.df, 1)}`);
  for (const g of r.collapsed_groups) {
    lines.push(`collapsed for the variance: ${g.strata.join(' + ')} (between-strata variance ${f(g.variance, 6)}, ${g.df} df; conservative)`);
  }
  if (r.total_unit !== null) {
    lines.push(`total  ${f(r.total, 2)}   SE ${f(r.total_se, 2)}   95 % CI ${r.total_ci95 ? `${f(r.total_ci95[0], 2)} to ${f(r.total_ci95[1], 2)}` : 'n/a'}   (${r.total_unit}, over ${r.area_ha.toFixed(2)} ha)`);
  }
  lines.push(`design effect ${f(r.deff, 3)} (vs a simple random sample of the same size)`, '', r.population);
  if (r.warnings.length > 0) lines.push('', 'Warnings:', ...r.warnings.map((w) => `  - ${w}`));
  lines.push('', 'Formulas (Cochran, Sampling Techniques, 3rd ed., 1977, ch. 5):', ...r.formulas.map((x) => `  - ${x}`), '');
  io.out(lines.join('\n'));
}

/** Next season's sizes, or the reason they cannot be given (a stratum without an SD, say). */
function nextSeason(r: EstimateReport, text: string): NextSeasonSampleSize | string {
  const relative = text.trim().endsWith('%');
  const value = optionNumber(relative ? text.trim().slice(0, -1) : text);
  if (text.trim() === '' || !(value > 0)) throw new InputError(`--next-halfwidth must be a number > 0, optionally with %, got "${text}"`);
  try {
    return nextSeasonSampleSize(
      r.strata.map((s) => ({ stratum: s.stratum, basisM2: s.basis_m2, sd: s.sd })),
      { target: { value: relative ? value / 100 : value, relative }, observedMean: r.mean, plotAreaM2: r.plot_area_m2 },
    );
  } catch (error) {
    if (isInputError(error)) return `next season: not sized — ${error.message}`;
    throw error;
  }
}

function printNext(next: NextSeasonSampleSize | string, io: CliIo): void {
  if (typeof next === 'string') {
    io.out(`${next}\n`);
    return;
  }
  const lines = [`Next season, for a 95 % CI half-width of ${next.targetHalfwidth.toFixed(4)} (Cochran 1977 ch. 5; t on the Satterthwaite df):`];
  for (const o of [next.proportional, next.neyman]) {
    lines.push(
      `  ${o.allocation.padEnd(12)} ${String(o.n).padStart(5)} plots: ${o.plots.map((p) => `${p.stratum} ${p.plots}`).join(', ')} (expected half-width ${o.halfwidth.toFixed(4)}${o.df === null ? '' : `, ${o.df.toFixed(1)} df`})`,
    );
  }
  lines.push(...next.notes.map((n) => `  - ${n}`), '');
  io.out(lines.join('\n'));
}

function reportJson(r: EstimateReport, next?: NextSeasonSampleSize | string): string {
  return JSON.stringify({
    variable: r.variable,
    strata: r.strata.map((s) => ({ stratum: s.stratum, n: s.n, mean: s.mean, sd: s.sd, se: s.se, weight: s.weight })),
    mean: r.mean,
    se: r.se,
    ci95: r.ci95,
    df: r.df,
    total: r.total,
    total_ci95: r.total_ci95,
    deff: r.deff,
    kind: r.kind,
    total_se: r.total_se,
    total_unit: r.total_unit,
    area_ha: r.area_ha,
    share_basis: r.share_basis,
    plot_area_m2: r.plot_area_m2,
    strata_detail: r.strata.map((s) => ({ stratum: s.stratum, group: s.group, basis_m2: s.basis_m2, sampling_fraction: s.sampling_fraction })),
    collapsed: r.collapsed,
    collapsed_groups: r.collapsed_groups,
    warnings: r.warnings,
    formulas: r.formulas,
    population: r.population,
    ...(next === undefined
      ? {}
      : typeof next === 'string'
        ? { next_season: { error: next } }
        : {
            next_season: {
              target_halfwidth: next.targetHalfwidth,
              proportional: { n: next.proportional.n, plots: next.proportional.plots, halfwidth: next.proportional.halfwidth },
              neyman: { n: next.neyman.n, plots: next.neyman.plots, halfwidth: next.neyman.halfwidth },
              notes: next.notes,
            },
          }),
  });
}

/** `stratplot estimate`: stratified estimates from a plot file and field results. */
export const estimateCommand: Command = {
  summary: 'stratified estimates with 95 % CIs from field results',
  usage: USAGE,
  async run(argv, io) {
    const parsed = parseOptions(argv);
    const { values, positionals } = parsed;
    if (positionals.length !== 2) throw new InputError('give the plot file and the results CSV, e.g. stratplot estimate plots.geojson results.csv --value cover');
    if (!values.value) throw new InputError('--value FIELD is required: the results column to estimate');
    const plotsFile = await readInputFile(io, positionals[0]);
    const resultsFile = await readInputFile(io, positionals[1]);
    const plots = parsePlotFile(plotsFile.name, plotsFile.bytes);
    const table = parseResultsCsv(resultsFile.name, resultsFile.bytes, { idColumn: values['id-column'] });
    const column = values.value;
    if (!table.columns.includes(column)) {
      throw new InputError(`${resultsFile.name}: no column "${column}"; columns are ${table.columns.join(', ')}`);
    }
    let kind: ResultKind;
    if (values.kind === undefined) kind = resultsKindGuess(column, table.rows.map((r) => r.cells[column]));
    else if ((RESULT_KINDS as readonly string[]).includes(values.kind)) kind = values.kind as ResultKind;
    else throw new InputError(`--kind must be one of ${RESULT_KINDS.join(', ')}, got "${values.kind}"`);
    const report = estimateFromResults(plots, table, { value: column, kind, collapse: values.collapse === true, perHa: values['per-ha'] === true });
    const next = values['next-halfwidth'] === undefined ? undefined : nextSeason(report, values['next-halfwidth']);
    if (values.out) {
      const semicolon = table.delimiter === ';' || table.decimal === ',';
      const csv = estimatesToCsv(report, semicolon ? { delimiter: ';', decimal: table.decimal } : {});
      try {
        await writeFile(resolve(io.cwd, values.out), csv);
      } catch (error) {
        throw new InputError(`cannot write ${values.out}: ${(error as Error).message}`);
      }
    }
    if (values.json) io.out(`${reportJson(report, next)}\n`);
    else {
      printTable(report, io);
      if (next !== undefined) printNext(next, io);
    }
    return 0;
  },
};

function parseOptions(argv: string[]) {
  return parseArgs({
    args: argv,
    allowPositionals: true,
    strict: true,
    options: {
      value: { type: 'string' },
      'id-column': { type: 'string' },
      kind: { type: 'string' },
      'per-ha': { type: 'boolean' },
      'next-halfwidth': { type: 'string' },
      collapse: { type: 'boolean' },
      out: { type: 'string' },
      json: { type: 'boolean' },
    },
  });
}

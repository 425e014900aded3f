import type { PlotCollection, PlotProperties } from '../model/designTypes';
import { plotFieldStates } from '../field/plotFieldState';
import { type DecimalMark, resultsCellNumber, resultsCellPresence } from './resultsCellParse';
import { resultsValueRead } from './resultsValueRead';
import type { ResultKind } from '../model/designTypes';
import type { Problem } from '../model/types';

/** One data row of a results table; `row` is the spreadsheet row number (the header is row 1). */
export interface ResultsRow {
  row: number;
  cells: Record<string, string>;
}

/** A results table as read from a spreadsheet export, cells still as text. */
export interface ResultsTable {
  fileName: string;
  columns: string[];
  idColumn: string;
  delimiter: ',' | ';' | '\t';
  decimal: DecimalMark;
  rows: ResultsRow[];
}

/** The variable to estimate and its kind (which sets the range check). */
export interface ResultsVariable {
  column: string;
  kind: ResultKind;
}

/** One usable measurement. */
export interface ResultsObservation {
  plotId: string;
  stratum: string;
  role: 'primary' | 'reserve';
  value: number;
  row: number;
}

export interface ResultsReview {
  problems: Problem[];
  observations: ResultsObservation[];
}

/** Status column and replacement column names the checks look for. */
export const RESULTS_STATUS_COLUMN = 'status';
export const RESULTS_REPLACED_BY_COLUMN = 'replaced_by';

const DONE = new Set(['', 'done', 'measured', 'ok', 'complete', 'completed']);
const REJECTED = new Set(['rejected', 'reject', 'not reached', 'inaccessible', 'unsafe']);

interface PlanPlot {
  props: PlotProperties;
  featureIndex: number;
}

/**
 * Checks a results table against the plot file and collects the measurements to estimate from.
 * Errors (the estimate must not run): ids not in the plan, duplicated ids, unknown status words,
 * a replacement that is not a reserve of the same stratum or is used twice, non-numeric values,
 * values out of range for the kind (cover outside 0–100, negative or fractional counts, presence
 * words unknown, magnitudes beyond MAX_RESULT_MAGNITUDE, e.g. 1e400), a table with no data rows,
 * and a column with no value or no number at all (a text column).
 * Warnings: primaries with no result and no replacement, rows marked done (or another status
 * word) whose value is empty, reserves used out of rank order (a reserve of rank k used while a
 * lower-ranked one of the same stratum is unused), reserves measured without replacing anything,
 * values given for rejected plots (ignored).
 * Every message names the file, row, column and value; each Problem's `where` holds the spreadsheet
 * `row`, the `column` and the plot id, with `featureIndex` the 0-based data row (−1 when the problem
 * concerns a plot that has no row).
 */
export function resultsReview(plots: PlotCollection, table: ResultsTable, variable: ResultsVariable): ResultsReview {
  const v = reviewStart(plots, table, variable);
  if (table.rows.length === 0) {
    v.add('error', 'results-no-rows', `${table.fileName}: no data rows under the header; nothing to estimate`, null, table.idColumn);
    return { problems: v.problems, observations: v.observations };
  }
  for (const r of table.rows) rowRead(v, r);
  columnKindChecked(v);
  reserveOrderCheck(v, plotsWithoutResultCheck(v));
  return { problems: v.problems, observations: v.observations };
}

/** What the review has found so far: the problems, the measurements, and the field decisions by plot. */
interface Review {
  table: ResultsTable;
  variable: ResultsVariable;
  plots: PlotCollection;
  plan: Map<string, PlanPlot>;
  problems: Problem[];
  observations: ResultsObservation[];
  rowOf: Map<string, ResultsRow>;
  doneEmpty: Set<string>;
  rejected: Set<string>;
  /** Rejected plot → the reserve that replaces it (and the row that said so, null when the plan did). */
  replacement: Map<string, { by: string; row: ResultsRow | null }>;
  /** Reserve → the plot it replaces. */
  replacedBy: Map<string, string>;
  measured: Set<string>;
  at(r: ResultsRow, column: string): string;
  add(severity: Problem['severity'], code: string, message: string, r: ResultsRow | null, column: string, id?: string): void;
}

/** The review's starting point: the plan's plots by id, and the decisions already recorded on them. */
function reviewStart(plots: PlotCollection, table: ResultsTable, variable: ResultsVariable): Review {
  const plan = new Map<string, PlanPlot>();
  plots.features.forEach((f, featureIndex) => {
    plan.set(f.properties.plot_id, { props: f.properties, featureIndex });
  });
  const rowIndex = new Map<ResultsRow, number>();
  table.rows.forEach((r, i) => {
    rowIndex.set(r, i);
  });
  const problems: Problem[] = [];
  const v: Review = {
    table,
    variable,
    plots,
    plan,
    problems,
    observations: [],
    rowOf: new Map(),
    doneEmpty: new Set(),
    rejected: new Set(),
    replacement: new Map(),
    replacedBy: new Map(),
    measured: new Set(),
    at: (r, column) => `${table.fileName} row ${r.row}, column ${column}`,
    add: (severity, code, message, r, column, id) => {
      problems.push({ severity, code, message, where: { featureIndex: r ? (rowIndex.get(r) ?? -1) : -1, featureId: id, row: r?.row, column } });
    },
  };
  // Decisions already recorded on the plots (the plan's field state) count as if the file gave them.
  for (const [id, st] of plotFieldStates(plots.features.map((f) => f.properties))) {
    if (st.key === 'rejected') v.rejected.add(id);
    if (st.key === 'promoted') {
      v.replacement.set(st.replaces, { by: id, row: null });
      v.replacedBy.set(id, st.replaces);
    }
  }
  return v;
}

/** One data row: its id, status, replacement and value, each checked; a usable value becomes an observation. */
function rowRead(v: Review, r: ResultsRow): void {
  const { table, variable } = v;
  const idCol = table.idColumn;
  const id = (r.cells[idCol] ?? '').trim();
  if (id === '') {
    v.add('error', 'results-empty-id', `${v.at(r, idCol)}: no plot id`, r, idCol);
    return;
  }
  const planned = v.plan.get(id);
  if (!planned) {
    v.add('error', 'results-unknown-id', `${v.at(r, idCol)}: "${id}" is not a plot of the plan`, r, idCol, id);
    return;
  }
  const first = v.rowOf.get(id);
  if (first) {
    v.add('error', 'results-duplicate-id', `${v.at(r, idCol)}: "${id}" appears again (first at row ${first.row})`, r, idCol, id);
    return;
  }
  v.rowOf.set(id, r);
  const statusText = table.columns.includes(RESULTS_STATUS_COLUMN) ? (r.cells[RESULTS_STATUS_COLUMN] ?? '').trim().toLowerCase() : '';
  const isRejected = REJECTED.has(statusText);
  if (!isRejected && !DONE.has(statusText)) {
    v.add('error', 'results-bad-status', `${v.at(r, RESULTS_STATUS_COLUMN)}: "${statusText}" is not a status (use done or rejected)`, r, RESULTS_STATUS_COLUMN, id);
    return;
  }
  const by = table.columns.includes(RESULTS_REPLACED_BY_COLUMN) ? (r.cells[RESULTS_REPLACED_BY_COLUMN] ?? '').trim() : '';
  if (isRejected) v.rejected.add(id);
  if (by !== '') replacementCheck(v, id, by, isRejected, planned, r);
  const cell = r.cells[variable.column] ?? '';
  if (isRejected) {
    if (cell.trim() !== '') v.add('warning', 'results-value-on-rejected', `${v.at(r, variable.column)}: value "${cell.trim()}" ignored because plot ${id} is rejected`, r, variable.column, id);
    return;
  }
  const value = valueRead(v, cell, r, id);
  if (value === undefined) {
    if (cell.trim() === '' && statusText !== '') {
      v.doneEmpty.add(id);
      v.add('warning', 'results-done-empty', `${v.at(r, variable.column)}: plot ${id} is marked "${statusText}" but has no value; it is left out of the estimate`, r, variable.column, id);
    }
    return;
  }
  v.measured.add(id);
  v.observations.push({ plotId: id, stratum: planned.props.stratum, role: planned.props.role, value, row: r.row });
}

/** A replacement given for a rejected plot must be an unused reserve of the same stratum. */
function replacementCheck(v: Review, id: string, by: string, isRejected: boolean, planned: PlanPlot, r: ResultsRow): void {
  const col = RESULTS_REPLACED_BY_COLUMN;
  if (!isRejected) {
    v.add('error', 'results-replacement-not-rejected', `${v.at(r, col)}: "${by}" given as a replacement, but plot ${id} is not marked rejected`, r, col, id);
    return;
  }
  const target = v.plan.get(by);
  if (!target) {
    v.add('error', 'results-unknown-replacement', `${v.at(r, col)}: "${by}" is not a plot of the plan`, r, col, id);
    return;
  }
  if (target.props.role !== 'reserve' || target.props.stratum !== planned.props.stratum) {
    v.add('error', 'results-replacement-not-reserve', `${v.at(r, col)}: "${by}" is not a reserve of stratum "${planned.props.stratum}"`, r, col, id);
    return;
  }
  const earlier = v.replacedBy.get(by);
  if (earlier !== undefined && earlier !== id) {
    v.add('error', 'results-replacement-reused', `${v.at(r, col)}: reserve "${by}" already replaces ${earlier}`, r, col, id);
    return;
  }
  v.replacement.set(id, { by, row: r });
  v.replacedBy.set(by, id);
}

/** A cell's value by the variable's kind (resultsValueRead); undefined for a blank or a refused value. */
function valueRead(v: Review, cell: string, r: ResultsRow, id: string): number | undefined {
  const col = v.variable.column;
  const read = resultsValueRead(cell, v.variable.kind, v.table.decimal);
  if (read.ok) return read.value ?? undefined;
  v.add('error', read.code, `${v.at(r, col)}: ${read.problem}`, r, col, id);
  return undefined;
}

/**
 * A column that gave nothing to estimate and no error so far is empty, or a text column whose text
 * sits on rejected rows only (where values are ignored): refused, naming its first non-numeric cell.
 */
function columnKindChecked(v: Review): void {
  const { table, variable } = v;
  const col = variable.column;
  if (v.observations.length > 0 || v.problems.some((p) => p.severity === 'error')) return;
  let firstText: ResultsRow | null = null;
  for (const r of table.rows) {
    const text = (r.cells[col] ?? '').trim();
    if (text === '') continue;
    const x = variable.kind === 'presence' ? resultsCellPresence(text) : resultsCellNumber(text, table.decimal);
    if (x !== null && !Number.isNaN(x)) return;
    firstText ??= r;
  }
  if (firstText === null) {
    v.add('error', 'results-column-empty', `${table.fileName}, column ${col}: every cell is empty; nothing to estimate`, null, col);
    return;
  }
  const text = (firstText.cells[col] ?? '').trim();
  const want = variable.kind === 'presence' ? 'presence/absence values' : 'numbers';
  v.add('error', 'results-text-column', `${v.at(firstText, col)}: "${text.slice(0, 60)}" is not a number, and no other cell of column ${col} is: it is a text column, and the estimate needs ${want}`, firstText, col);
}

/**
 * Primaries with no result and no measured replacement, and reserves measured without replacing
 * anything. Returns the reserves of each stratum, for the rank-order check.
 */
function plotsWithoutResultCheck(v: Review): Map<string, PlotProperties[]> {
  const { table, variable } = v;
  const idCol = table.idColumn;
  const reservesByStratum = new Map<string, PlotProperties[]>();
  for (const f of v.plots.features) {
    const p = f.properties;
    if (p.role === 'primary') {
      if (v.measured.has(p.plot_id) || v.doneEmpty.has(p.plot_id)) continue;
      const r = v.rowOf.get(p.plot_id) ?? null;
      const col = r ? variable.column : idCol;
      const rep = v.replacement.get(p.plot_id);
      if (v.rejected.has(p.plot_id) && rep) {
        if (!v.measured.has(rep.by)) {
          v.add('warning', 'results-replacement-missing', `${table.fileName}: reserve ${rep.by}, which replaces ${p.plot_id}, has no result for ${variable.column}`, rep.row, RESULTS_REPLACED_BY_COLUMN, rep.by);
        }
        continue;
      }
      const where = r ? `${v.at(r, col)}: primary ${p.plot_id}` : `${table.fileName}: primary ${p.plot_id} has no row and`;
      const why = v.rejected.has(p.plot_id) ? 'is rejected with no replacement' : r ? 'has no result and no replacement' : 'no replacement';
      v.add('warning', 'results-primary-missing', `${where} ${why} (stratum "${p.stratum}" is short by one plot)`, r, col, p.plot_id);
    } else {
      const list = reservesByStratum.get(p.stratum) ?? [];
      list.push(p);
      reservesByStratum.set(p.stratum, list);
      if (v.measured.has(p.plot_id) && !v.replacedBy.has(p.plot_id)) {
        const r = v.rowOf.get(p.plot_id) ?? null;
        v.add('warning', 'results-reserve-unassigned', `${r ? v.at(r, idCol) : table.fileName}: reserve ${p.plot_id} has a result but replaces no rejected plot (give it in the rejected plot's ${RESULTS_REPLACED_BY_COLUMN})`, r, idCol, p.plot_id);
      }
    }
  }
  return reservesByStratum;
}

/** Reserves must be used in rank order: a reserve of rank k used while a lower-ranked one of its stratum is unused is flagged. */
function reserveOrderCheck(v: Review, reservesByStratum: Map<string, PlotProperties[]>): void {
  const idCol = v.table.idColumn;
  for (const [stratum, reserves] of reservesByStratum) {
    reserves.sort((a, b) => a.rank - b.rank);
    const used = (p: PlotProperties) => v.replacedBy.has(p.plot_id) || v.measured.has(p.plot_id);
    for (const [k, p] of reserves.entries()) {
      if (!used(p)) continue;
      const skipped = reserves.slice(0, k).find((q) => !used(q));
      if (!skipped) continue;
      const replaced = v.replacedBy.get(p.plot_id);
      const rep = replaced === undefined ? undefined : v.replacement.get(replaced);
      const r = rep?.row ?? v.rowOf.get(p.plot_id) ?? null;
      const col = rep?.row ? RESULTS_REPLACED_BY_COLUMN : idCol;
      v.add('warning', 'results-reserve-order', `${r ? v.at(r, col) : v.table.fileName}: reserve ${p.plot_id} (rank ${p.rank}) is used while ${skipped.plot_id} (rank ${skipped.rank}) of stratum "${stratum}" is unused; reserves must be used in rank order`, r, col, p.plot_id);
    }
  }
}

/** The problems {@link resultsReview} finds, errors and warnings, in the order found. */
export function resultsCheck(plots: PlotCollection, table: ResultsTable, variable: ResultsVariable): Problem[] {
  return resultsReview(plots, table, variable).problems;
}

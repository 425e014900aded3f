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
  const problems: Problem[] = [];
  const observations: ResultsObservation[] = [];
  const plan = new Map<string, PlanPlot>();
  plots.features.forEach((f, featureIndex) => {
    plan.set(f.properties.plot_id, { props: f.properties, featureIndex });
  });
  const rowIndex = new Map<ResultsRow, number>();
  table.rows.forEach((r, i) => {
    rowIndex.set(r, i);
  });
  const at = (r: ResultsRow, column: string) => `${table.fileName} row ${r.row}, column ${column}`;
  const add = (severity: Problem['severity'], code: string, message: string, r: ResultsRow | null, column: string, id?: string) => {
    problems.push({
      severity,
      code,
      message,
      where: { featureIndex: r ? (rowIndex.get(r) ?? -1) : -1, featureId: id, row: r?.row, column },
    });
  };
  const hasStatus = table.columns.includes(RESULTS_STATUS_COLUMN);
  const hasReplaced = table.columns.includes(RESULTS_REPLACED_BY_COLUMN);
  const idCol = table.idColumn;

  if (table.rows.length === 0) {
    add('error', 'results-no-rows', `${table.fileName}: no data rows under the header; nothing to estimate`, null, idCol);
    return { problems, observations };
  }

  const rowOf = new Map<string, ResultsRow>();
  const doneEmpty = new Set<string>();
  const rejected = new Set<string>();
  const replacement = new Map<string, { by: string; row: ResultsRow | null }>();
  const replacedBy = new Map<string, string>();
  const measured = new Set<string>();

  // Decisions already recorded on the plots (the plan's field state) count as if the file gave them.
  for (const [id, s] of plotFieldStates(plots.features.map((f) => f.properties))) {
    if (s.key === 'rejected') rejected.add(id);
    if (s.key === 'promoted') {
      replacement.set(s.replaces, { by: id, row: null });
      replacedBy.set(id, s.replaces);
    }
  }

  for (const r of table.rows) {
    const id = (r.cells[idCol] ?? '').trim();
    if (id === '') {
      add('error', 'results-empty-id', `${at(r, idCol)}: no plot id`, r, idCol);
      continue;
    }
    const planned = plan.get(id);
    if (!planned) {
      add('error', 'results-unknown-id', `${at(r, idCol)}: "${id}" is not a plot of the plan`, r, idCol, id);
      continue;
    }
    const first = rowOf.get(id);
    if (first) {
      add('error', 'results-duplicate-id', `${at(r, idCol)}: "${id}" appears again (first at row ${first.row})`, r, idCol, id);
      continue;
    }
    rowOf.set(id, r);
    const statusText = hasStatus ? (r.cells[RESULTS_STATUS_COLUMN] ?? '').trim().toLowerCase() : '';
    const isRejected = REJECTED.has(statusText);
    if (!isRejected && !DONE.has(statusText)) {
      add('error', 'results-bad-status', `${at(r, RESULTS_STATUS_COLUMN)}: "${statusText}" is not a status (use done or rejected)`, r, RESULTS_STATUS_COLUMN, id);
      continue;
    }
    const by = hasReplaced ? (r.cells[RESULTS_REPLACED_BY_COLUMN] ?? '').trim() : '';
    if (isRejected) rejected.add(id);
    if (by !== '') {
      checkReplacement(id, by, isRejected, planned, r);
    }
    const cell = r.cells[variable.column] ?? '';
    if (isRejected) {
      if (cell.trim() !== '') add('warning', 'results-value-on-rejected', `${at(r, variable.column)}: value "${cell.trim()}" ignored because plot ${id} is rejected`, r, variable.column, id);
      continue;
    }
    const value = readValue(cell, r, id);
    if (value === undefined) {
      if (cell.trim() === '' && statusText !== '') {
        doneEmpty.add(id);
        add('warning', 'results-done-empty', `${at(r, variable.column)}: plot ${id} is marked "${statusText}" but has no value; it is left out of the estimate`, r, variable.column, id);
      }
      continue;
    }
    measured.add(id);
    observations.push({ plotId: id, stratum: planned.props.stratum, role: planned.props.role, value, row: r.row });
  }

  function checkReplacement(id: string, by: string, isRejected: boolean, planned: PlanPlot, r: ResultsRow) {
    const col = RESULTS_REPLACED_BY_COLUMN;
    if (!isRejected) {
      add('error', 'results-replacement-not-rejected', `${at(r, col)}: "${by}" given as a replacement, but plot ${id} is not marked rejected`, r, col, id);
      return;
    }
    const target = plan.get(by);
    if (!target) {
      add('error', 'results-unknown-replacement', `${at(r, col)}: "${by}" is not a plot of the plan`, r, col, id);
      return;
    }
    if (target.props.role !== 'reserve' || target.props.stratum !== planned.props.stratum) {
      add('error', 'results-replacement-not-reserve', `${at(r, col)}: "${by}" is not a reserve of stratum "${planned.props.stratum}"`, r, col, id);
      return;
    }
    const earlier = replacedBy.get(by);
    if (earlier !== undefined && earlier !== id) {
      add('error', 'results-replacement-reused', `${at(r, col)}: reserve "${by}" already replaces ${earlier}`, r, col, id);
      return;
    }
    replacement.set(id, { by, row: r });
    replacedBy.set(by, id);
  }

  /**
   * A column that gave nothing to estimate and no error so far is empty, or a text column whose text
   * sits on rejected rows only (where values are ignored): refused, naming its first non-numeric cell.
   */
  function columnKindChecked(): void {
    const col = variable.column;
    if (observations.length > 0 || problems.some((p) => p.severity === 'error')) return;
    let firstText: ResultsRow | null = null;
    for (const r of table.rows) {
      const text = (r.cells[col] ?? '').trim();
      if (text === '') continue;
      const v = variable.kind === 'presence' ? resultsCellPresence(text) : resultsCellNumber(text, table.decimal);
      if (v !== null && !Number.isNaN(v)) return;
      firstText ??= r;
    }
    if (firstText === null) {
      add('error', 'results-column-empty', `${table.fileName}, column ${col}: every cell is empty; nothing to estimate`, null, col);
      return;
    }
    const text = (firstText.cells[col] ?? '').trim();
    const want = variable.kind === 'presence' ? 'presence/absence values' : 'numbers';
    add('error', 'results-text-column', `${at(firstText, col)}: "${text.slice(0, 60)}" is not a number, and no other cell of column ${col} is: it is a text column, and the estimate needs ${want}`, firstText, col);
  }

  function readValue(cell: string, r: ResultsRow, id: string): number | undefined {
    const col = variable.column;
    const read = resultsValueRead(cell, variable.kind, table.decimal);
    if (read.ok) return read.value ?? undefined;
    add('error', read.code, `${at(r, col)}: ${read.problem}`, r, col, id);
    return undefined;
  }

  columnKindChecked();
  const reservesByStratum = new Map<string, PlotProperties[]>();
  for (const f of plots.features) {
    const p = f.properties;
    if (p.role === 'primary') {
      if (measured.has(p.plot_id) || doneEmpty.has(p.plot_id)) continue;
      const r = rowOf.get(p.plot_id) ?? null;
      const col = r ? variable.column : idCol;
      const rep = replacement.get(p.plot_id);
      if (rejected.has(p.plot_id) && rep) {
        if (!measured.has(rep.by)) {
          add('warning', 'results-replacement-missing', `${table.fileName}: reserve ${rep.by}, which replaces ${p.plot_id}, has no result for ${variable.column}`, rep.row, RESULTS_REPLACED_BY_COLUMN, rep.by);
        }
        continue;
      }
      const where = r ? `${at(r, col)}: primary ${p.plot_id}` : `${table.fileName}: primary ${p.plot_id} has no row and`;
      const why = rejected.has(p.plot_id) ? 'is rejected with no replacement' : r ? 'has no result and no replacement' : 'no replacement';
      add('warning', 'results-primary-missing', `${where} ${why} (stratum "${p.stratum}" is short by one plot)`, r, col, p.plot_id);
    } else {
      const list = reservesByStratum.get(p.stratum) ?? [];
      list.push(p);
      reservesByStratum.set(p.stratum, list);
      if (measured.has(p.plot_id) && !replacedBy.has(p.plot_id)) {
        const r = rowOf.get(p.plot_id) ?? null;
        add('warning', 'results-reserve-unassigned', `${r ? at(r, idCol) : table.fileName}: reserve ${p.plot_id} has a result but replaces no rejected plot (give it in the rejected plot's ${RESULTS_REPLACED_BY_COLUMN})`, r, idCol, p.plot_id);
      }
    }
  }

  for (const [stratum, reserves] of reservesByStratum) {
    reserves.sort((a, b) => a.rank - b.rank);
    const used = (p: PlotProperties) => replacedBy.has(p.plot_id) || measured.has(p.plot_id);
    for (const [k, p] of reserves.entries()) {
      if (!used(p)) continue;
      const skipped = reserves.slice(0, k).find((q) => !used(q));
      if (!skipped) continue;
      const replaced = replacedBy.get(p.plot_id);
      const rep = replaced === undefined ? undefined : replacement.get(replaced);
      const r = rep?.row ?? rowOf.get(p.plot_id) ?? null;
      const col = rep?.row ? RESULTS_REPLACED_BY_COLUMN : idCol;
      add('warning', 'results-reserve-order', `${r ? at(r, col) : table.fileName}: reserve ${p.plot_id} (rank ${p.rank}) is used while ${skipped.plot_id} (rank ${skipped.rank}) of stratum "${stratum}" is unused; reserves must be used in rank order`, r, col, p.plot_id);
    }
  }
  return { problems, observations };
}

/** The problems {@link resultsReview} finds, errors and warnings, in the order found. */
export function resultsCheck(plots: PlotCollection, table: ResultsTable, variable: ResultsVariable): Problem[] {
  return resultsReview(plots, table, variable).problems;
}

import { createStore, type StoreApi } from 'zustand/vanilla';
import { FIELD_RESULTS_FIXED_COLUMNS } from '../core/field/fieldVariablesCheck';
import type { DesignSettings, PlotCollection } from '../core/model/designTypes';
import type { RecaptureGridSaved } from './planFileTypes';
import { type EstimateReport, estimateFromResults } from '../core/results/estimateFromResults';
import { isInputError } from '../core/common/InputError';
import { type NextSeasonSampleSize, nextSeasonSampleSize } from '../core/results/nextSeasonSampleSize';
import { resultsKindGuess } from '../core/results/resultsCellParse';
import type { ResultKind } from '../core/model/designTypes';
import { type ResultsTable, resultsReview } from '../core/results/resultsCheck';
import type { Problem } from '../core/model/types';
import { parseResultsCsv } from '../io/results/parseResultsCsv';
import { headerNames, idColumnGuess, problemsInUserNames, type ResultsMapping, tableForCore } from './resultsColumnMapping';

export type { ResultsMapping };


/** A recapture grid as typed in the form: the same record the plan file keeps. */
export type RecaptureGridForm = RecaptureGridSaved;

/** Plot colours for the map: one colour per measured plot and the value range of the ramp. */
export interface ResultsColouring {
  variable: string;
  colours: Record<string, string>;
  min: number;
  max: number;
}

export interface ResultsState {
  fileName: string | null;
  /** The loaded file's text, kept so the plan file and the browser copy can read it again. */
  sourceText: string | null;
  table: ResultsTable | null;
  /** Why the last file could not be read (the file is then not loaded). */
  loadError: string | null;
  mapping: ResultsMapping | null;
  variable: string | null;
  collapse: boolean;
  perHa: boolean;
  problems: Problem[];
  report: EstimateReport | null;
  /** Why no estimate is shown (errors in the results, a stratum without plots...). */
  estimateError: string | null;
  /** Valid values of the chosen variable by plot id: { plot_id: { variable: value } }. */
  plotValues: Record<string, Record<string, number>>;
  target: { value: number; relative: boolean };
  next: NextSeasonSampleSize | null;
  /** The SDs next season's figures use, by stratum (observed, or of the collapsed group). */
  nextSd: Record<string, number>;
  nextError: string | null;
  colourOn: boolean;
  colouring: ResultsColouring | null;
  grids: RecaptureGridForm[];
}

export type ResultsStore = StoreApi<ResultsState>;

/** A new, empty results store (zustand vanilla): no file, ±10 % target, one empty recapture grid. */
export function resultsStoreCreate(): ResultsStore {
  return createStore<ResultsState>()(() => ({
    fileName: null,
    sourceText: null,
    table: null,
    loadError: null,
    mapping: null,
    variable: null,
    collapse: false,
    perHa: false,
    problems: [],
    report: null,
    estimateError: null,
    plotValues: {},
    target: { value: 0.1, relative: true },
    next: null,
    nextSd: {},
    nextError: null,
    colourOn: false,
    colouring: null,
    grids: [recaptureGridBlank(1)],
  }));
}

/** An empty recapture form named "Grid k", for a grid of stations. */
export function recaptureGridBlank(k: number): RecaptureGridForm {
  return { id: `grid-${k}`, name: `Grid ${k}`, marked: '', caught: '', recaptured: '', stripM: '', by: 'stations', areaHa: '', spacingM: '', rows: '', cols: '' };
}

function errorText(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

/**
 * Reads a results CSV (comma, semicolon or tab; BOM; decimal comma — see parseResultsCsv), guesses
 * the id, status and replacement columns and the kind of every other column, picks the first
 * variable and estimates it. A file that cannot be read leaves the previous one loaded and sets
 * `loadError` to a message naming the file and row.
 */
export function resultsLoad(store: ResultsStore, fileName: string, bytes: Uint8Array | string, collection: PlotCollection | null): void {
  let table: ResultsTable;
  try {
    try {
      table = parseResultsCsv(fileName, bytes);
    } catch (e) {
      if (!isInputError(e) || !e.message.includes('no column "plot_id"')) throw e;
      table = parseResultsCsv(fileName, bytes, { idColumn: headerNames(bytes)[0] });
    }
  } catch (e) {
    store.setState({ loadError: errorText(e) });
    return;
  }
  const idColumn = collection ? idColumnGuess(table, collection) : table.idColumn;
  const find = (re: RegExp) => table.columns.find((c) => c !== idColumn && re.test(c)) ?? null;
  const statusColumn = find(/^status$/i) ?? find(/status|visit/i);
  const replacedByColumn = find(/^replaced_by$/i) ?? find(/replac|reserve.?used|substitut/i);
  const kinds: Record<string, ResultKind> = {};
  for (const c of table.columns) {
    if (c === idColumn || c === statusColumn || c === replacedByColumn) continue;
    kinds[c] = resultsKindGuess(c, table.rows.map((r) => r.cells[c] ?? ''));
  }
  // A field results table (fieldResultsToCsv) leads with its fixed columns: the first measurement comes after them.
  const fixed = new Set<string>(FIELD_RESULTS_FIXED_COLUMNS);
  const variable = Object.keys(kinds).find((c) => !fixed.has(c)) ?? Object.keys(kinds)[0] ?? null;
  const sourceText = typeof bytes === 'string' ? bytes : new TextDecoder().decode(bytes);
  store.setState({ fileName, sourceText, table, loadError: null, mapping: { idColumn, statusColumn, replacedByColumn, kinds }, variable });
  resultsRecompute(store, collection);
}

/** Changes which column is the id, status or replacement column, or a variable's kind; re-estimates. */
export function resultsMappingSet(store: ResultsStore, patch: Partial<Omit<ResultsMapping, 'kinds'>> & { kinds?: Record<string, ResultKind> }, collection: PlotCollection | null): void {
  const s = store.getState();
  if (!s.mapping || !s.table) return;
  const m = { ...s.mapping, ...patch, kinds: { ...s.mapping.kinds, ...patch.kinds } };
  const roles = new Set([m.idColumn, m.statusColumn, m.replacedByColumn]);
  for (const c of s.table.columns) {
    if (roles.has(c)) delete m.kinds[c];
    else if (m.kinds[c] === undefined) m.kinds[c] = resultsKindGuess(c, s.table.rows.map((r) => r.cells[c] ?? ''));
  }
  const variable = s.variable !== null && m.kinds[s.variable] !== undefined ? s.variable : (Object.keys(m.kinds)[0] ?? null);
  store.setState({ mapping: m, variable });
  resultsRecompute(store, collection);
}

/** Chooses the variable to estimate, the collapse and per-ha options, the next-season target, or the map colouring. */
export function resultsOptionsSet(
  store: ResultsStore,
  patch: Partial<Pick<ResultsState, 'variable' | 'collapse' | 'perHa' | 'target' | 'colourOn'>>,
  collection: PlotCollection | null,
): void {
  store.setState(patch);
  resultsRecompute(store, collection);
}

/** Sets the plot colouring the map shows (worked out by the app's colour ramp). */
export function resultsColouringSet(store: ResultsStore, colouring: ResultsColouring | null): void {
  store.setState({ colouring });
}

/** Re-runs the checks, the estimate and next season's sizes for the current file, mapping and options. */
function resultsRecompute(store: ResultsStore, collection: PlotCollection | null): void {
  const s = store.getState();
  const cleared = { problems: [], report: null, plotValues: {}, next: null, nextSd: {}, nextError: null, colouring: null };
  let blocked: string | null | undefined;
  if (!s.table || !s.mapping) blocked = null;
  else if (!collection) blocked = 'Make a design (or open a plan with plots) first: results are matched to its plots by id.';
  else if (s.variable === null || s.mapping.kinds[s.variable] === undefined) {
    blocked = 'Choose a column to estimate: this file has no measurement columns besides the id, status and replacement columns.';
  }
  if (blocked !== undefined || !s.table || !s.mapping || !collection || s.variable === null) {
    store.setState({ ...cleared, estimateError: blocked ?? null });
    return;
  }
  const kind = s.mapping.kinds[s.variable];
  const { table, coreName } = tableForCore(s.table, s.mapping);
  const value = coreName(s.variable);
  const review = resultsReview(collection, table, { column: value, kind });
  const problems = problemsInUserNames(review.problems, s.mapping);
  const plotValues: Record<string, Record<string, number>> = {};
  for (const o of review.observations) plotValues[o.plotId] = { [s.variable]: o.value };
  let report: EstimateReport | null = null;
  let estimateError: string | null = null;
  try {
    report = estimateFromResults(collection, table, { value, kind, collapse: s.collapse, perHa: s.perHa });
    report = { ...report, variable: s.variable };
  } catch (e) {
    const errors = problems.filter((p) => p.severity === 'error').length;
    estimateError = errors > 0 ? `No estimate until the ${errors} error${errors > 1 ? 's' : ''} listed under Problems ${errors > 1 ? 'are' : 'is'} fixed in the file.` : errorText(e);
  }
  const nextPart = report ? nextSeasonFor(collection, s, report) : { next: null, nextSd: {}, nextError: null };
  store.setState({ problems, report, estimateError, plotValues, ...nextPart, colouring: s.colourOn ? s.colouring : null });
}

/**
 * Next season's sizes from this season's per-stratum SDs. Strata too small for an SD of their own
 * borrow the SD of their collapsed group's plots pooled when collapsing is on (a planning value).
 */
function nextSeasonFor(collection: PlotCollection, s: ResultsState, report: EstimateReport): Pick<ResultsState, 'next' | 'nextSd' | 'nextError'> {
  try {
    const sdOverride: Record<string, number> = {};
    for (const g of report.collapsed_groups) {
      if (g.pooled_sd === null) continue;
      for (const k of g.strata) if ((report.strata.find((x) => x.stratum === k)?.sd ?? null) === null) sdOverride[k] = g.pooled_sd;
    }
    const next = nextSeasonSampleSize(
      report.strata.map((x) => ({ stratum: x.stratum, basisM2: x.basis_m2, sd: x.sd })),
      { target: s.target, observedMean: report.mean, plotAreaM2: report.plot_area_m2, minPerStratum: Math.max(2, collection.design.settings.minPerStratum), sdOverride },
    );
    const nextSd = Object.fromEntries(report.strata.map((x) => [x.stratum, sdOverride[x.stratum] ?? (x.sd as number)]));
    return { next, nextSd, nextError: null };
  } catch (e) {
    return { next: null, nextSd: {}, nextError: errorText(e) };
  }
}

/**
 * The design settings change that plans next season with one of the computed sizes: total plots,
 * the allocation and the observed SDs (the target is cleared so the total is used as it stands).
 */
export function resultsDesignPatch(state: Pick<ResultsState, 'next' | 'nextSd'>, allocation: 'proportional' | 'neyman'): Partial<DesignSettings> | null {
  if (!state.next) return null;
  const option = allocation === 'neyman' ? state.next.neyman : state.next.proportional;
  return { plots: option.n, allocation, sd: { ...state.nextSd }, targetHalfwidth: null };
}

/** Adds an empty recapture grid form. */
export function recaptureGridAdd(store: ResultsStore): void {
  const grids = store.getState().grids;
  const k = grids.reduce((a, g) => Math.max(a, Number(g.id.replace('grid-', '')) || 0), 0) + 1;
  store.setState({ grids: [...grids, recaptureGridBlank(k)] });
}

/** Changes fields of one recapture grid form. */
export function recaptureGridSet(store: ResultsStore, id: string, patch: Partial<Omit<RecaptureGridForm, 'id'>>): void {
  store.setState({ grids: store.getState().grids.map((g) => (g.id === id ? { ...g, ...patch } : g)) });
}

/** Removes one recapture grid form. */
export function recaptureGridRemove(store: ResultsStore, id: string): void {
  store.setState({ grids: store.getState().grids.filter((g) => g.id !== id) });
}

/** Forgets the loaded file and everything worked out from it (the recapture forms stay). */
export function resultsClear(store: ResultsStore): void {
  store.setState({ fileName: null, sourceText: null, table: null, loadError: null, mapping: null, variable: null, problems: [], report: null, estimateError: null, plotValues: {}, next: null, nextSd: {}, nextError: null, colouring: null });
}

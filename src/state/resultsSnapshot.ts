import type { PlotCollection } from '../core/model/designTypes';
import type { RecaptureGridSaved, ResultsSnapshot } from './planFileTypes';
import { InputError } from '../core/common/InputError';
import { RESULT_KINDS, type ResultKind } from '../core/model/designTypes';
import { type ResultsState, type ResultsStore, recaptureGridBlank, resultsClear, resultsLoad, resultsMappingSet, resultsOptionsSet } from './resultsStore';

/** The fields of the results store a snapshot carries; a change to any of them is work to keep. */
export const RESULTS_SNAPSHOT_FIELDS = ['fileName', 'sourceText', 'mapping', 'variable', 'collapse', 'perHa', 'target', 'colourOn', 'grids'] as const;

/**
 * What the planner made in the Results step, as plain data for the plan file: the CSV text and
 * its name, the column mapping, the options and the recapture forms (estimates are recomputed).
 */
export function resultsSnapshotTake(s: ResultsState): ResultsSnapshot {
  return {
    fileName: s.sourceText === null ? null : s.fileName,
    csvText: s.sourceText,
    mapping: s.sourceText === null || !s.mapping ? null : { ...s.mapping, kinds: { ...s.mapping.kinds } },
    variable: s.sourceText === null ? null : s.variable,
    collapse: s.collapse,
    perHa: s.perHa,
    target: { ...s.target },
    colourOn: s.colourOn,
    grids: s.grids.map((g) => ({ ...g })),
  };
}

/** True when a snapshot holds nothing the planner entered (no file, one untouched recapture form, default options). */
export function resultsSnapshotIsEmpty(snap: ResultsSnapshot): boolean {
  const blank = JSON.stringify(recaptureGridBlank(1));
  const gridsBlank = snap.grids.length === 1 && JSON.stringify(snap.grids[0]) === blank;
  return snap.csvText === null && gridsBlank && !snap.collapse && !snap.perHa && !snap.colourOn && snap.target.value === 0.1 && snap.target.relative;
}

/**
 * Puts a snapshot back into the results store, replacing what was there, and works the estimate out
 * again against `collection`. Plot ids that the design no longer has are not dropped: the checks
 * list them under Problems as for any file. A CSV that no longer reads sets `loadError`.
 */
export function resultsSnapshotRestore(store: ResultsStore, snap: ResultsSnapshot, collection: PlotCollection | null): void {
  resultsClear(store);
  const grids = snap.grids.length > 0 ? snap.grids.map((g) => ({ ...g })) : [recaptureGridBlank(1)];
  store.setState({ collapse: snap.collapse, perHa: snap.perHa, target: { ...snap.target }, colourOn: snap.colourOn, grids });
  if (snap.csvText === null) return;
  resultsLoad(store, snap.fileName ?? 'results.csv', snap.csvText, collection);
  if (!store.getState().table) return;
  if (snap.mapping) resultsMappingSet(store, snap.mapping, collection);
  const s = store.getState();
  if (snap.variable !== null && s.mapping?.kinds[snap.variable] !== undefined && snap.variable !== s.variable) {
    resultsOptionsSet(store, { variable: snap.variable }, collection);
  }
}

/** Resets the results store to a fresh one's contents (no file, default options, one empty recapture form). */
export function resultsReset(store: ResultsStore): void {
  resultsClear(store);
  store.setState({ collapse: false, perHa: false, target: { value: 0.1, relative: true }, colourOn: false, colouring: null, grids: [recaptureGridBlank(1)] });
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

const GRID_TEXT = ['id', 'name', 'marked', 'caught', 'recaptured', 'stripM', 'areaHa', 'spacingM', 'rows', 'cols'] as const;

function gridCheck(g: unknown, where: string): RecaptureGridSaved {
  if (!isObject(g)) throw new InputError(`${where} is not an object`);
  for (const k of GRID_TEXT) if (typeof g[k] !== 'string') throw new InputError(`${where}.${k} must be text`);
  if (g.by !== 'stations' && g.by !== 'area') throw new InputError(`${where}.by must be "stations" or "area"`);
  return g as unknown as RecaptureGridSaved;
}

function mappingCheck(m: unknown, where: string): ResultsSnapshot['mapping'] {
  if (m === null || m === undefined) return null;
  if (!isObject(m) || typeof m.idColumn !== 'string') throw new InputError(`${where} needs an idColumn name`);
  for (const k of ['statusColumn', 'replacedByColumn'] as const) {
    if (m[k] !== null && m[k] !== undefined && typeof m[k] !== 'string') throw new InputError(`${where}.${k} must be a column name or null`);
  }
  if (!isObject(m.kinds)) throw new InputError(`${where}.kinds must be an object`);
  for (const [c, k] of Object.entries(m.kinds)) {
    if (!(RESULT_KINDS as readonly string[]).includes(k as string)) throw new InputError(`${where}.kinds["${c}"] is ${String(k)}, not one of ${RESULT_KINDS.join(', ')}`);
  }
  return { idColumn: m.idColumn, statusColumn: (m.statusColumn as string | null) ?? null, replacedByColumn: (m.replacedByColumn as string | null) ?? null, kinds: m.kinds as Record<string, ResultKind> };
}

/**
 * Reads the `results` member of a plan file. Options missing from it take their defaults.
 * @throws InputError naming the file and the member when a field has the wrong type
 */
export function resultsSnapshotParse(data: unknown, fileName: string): ResultsSnapshot {
  const where = `${fileName}: results`;
  if (!isObject(data)) throw new InputError(`${where} is not an object`);
  const text = (k: string) => {
    const v = data[k] ?? null;
    if (v !== null && typeof v !== 'string') throw new InputError(`${where}.${k} must be text or null`);
    return v as string | null;
  };
  const flag = (k: string) => {
    const v = data[k] ?? false;
    if (typeof v !== 'boolean') throw new InputError(`${where}.${k} must be true or false`);
    return v;
  };
  const target = data.target ?? { value: 0.1, relative: true };
  if (!isObject(target) || typeof target.value !== 'number' || !(target.value > 0) || typeof target.relative !== 'boolean') {
    throw new InputError(`${where}.target needs a positive value and relative true or false`);
  }
  const grids = data.grids ?? [];
  if (!Array.isArray(grids)) throw new InputError(`${where}.grids must be a list`);
  return {
    fileName: text('fileName'),
    csvText: text('csvText'),
    mapping: mappingCheck(data.mapping, `${where}.mapping`),
    variable: text('variable'),
    collapse: flag('collapse'),
    perHa: flag('perHa'),
    target: { value: target.value, relative: target.relative },
    colourOn: flag('colourOn'),
    grids: grids.map((g, i) => gridCheck(g, `${where}.grids[${i}]`)),
  };
}

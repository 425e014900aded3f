import type { DesignSettings, PlanFile, ResultsSnapshot } from '../core/designTypes';
import { InputError } from '../core/InputError';
import type { Site } from '../core/types';
import type { PlannerState, PlannerStore } from './plannerStore';
import type { ResultsStore } from './resultsStore';
import { resultsReset, resultsSnapshotIsEmpty, resultsSnapshotParse, resultsSnapshotRestore } from './resultsSnapshot';

/**
 * The plan file for what the planner holds now (see ARCHITECTURE.md, "The plan file").
 * @param results the Results step's work; left out of the file when absent or empty
 */
export function planFileFromState(state: PlannerState, savedAt: string, results?: ResultsSnapshot | null): PlanFile {
  const plan: PlanFile = {
    format: 'stratplot-plan',
    version: 1,
    savedAt,
    site: state.site,
    design: state.design,
    result: state.result,
    rejections: state.rejections,
  };
  if (results && !resultsSnapshotIsEmpty(results)) plan.results = results;
  return plan;
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function siteCheck(site: unknown, fileName: string): Site {
  if (!isObject(site)) throw new InputError(`${fileName}: "site" is missing or not an object`);
  for (const key of ['strata', 'parts', 'exclusions', 'access'] as const) {
    if (!Array.isArray(site[key])) throw new InputError(`${fileName}: site.${key} must be a list`);
  }
  (site.parts as unknown[]).forEach((p, i) => {
    if (!isObject(p) || typeof p.stratum !== 'string' || !isObject(p.geometry)) {
      throw new InputError(`${fileName}: site.parts[${i}] needs a stratum name and a geometry`);
    }
    const type = (p.geometry as { type?: unknown }).type;
    if (type !== 'Polygon' && type !== 'MultiPolygon') throw new InputError(`${fileName}: site.parts[${i}] geometry is ${String(type)}, not a polygon`);
  });
  return site as unknown as Site;
}

/**
 * Reads a plan file's text. Throws InputError naming the file when it is not JSON, not a
 * stratplot plan, of a newer version than this program reads, or missing its site or design.
 */
export function planFileParse(text: string, fileName: string): PlanFile {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new InputError(`${fileName}: not valid JSON (${(e as Error).message})`);
  }
  if (!isObject(data) || data.format !== 'stratplot-plan') throw new InputError(`${fileName}: not a stratplot plan file (no "format": "stratplot-plan")`);
  if (data.version !== 1) throw new InputError(`${fileName}: plan version ${String(data.version)} is not one this program reads (it reads version 1)`);
  const site = siteCheck(data.site, fileName);
  if (!isObject(data.design)) throw new InputError(`${fileName}: "design" settings are missing`);
  const result = data.result ?? null;
  if (result !== null && (!isObject(result) || !Array.isArray(result.features))) throw new InputError(`${fileName}: "result" is not a plot collection`);
  const rejections = data.rejections ?? [];
  if (!Array.isArray(rejections)) throw new InputError(`${fileName}: "rejections" must be a list`);
  const results = data.results === undefined || data.results === null ? undefined : resultsSnapshotParse(data.results, fileName);
  return {
    format: 'stratplot-plan',
    version: 1,
    savedAt: typeof data.savedAt === 'string' ? data.savedAt : '',
    site,
    design: data.design as unknown as DesignSettings,
    result: result as PlanFile['result'],
    rejections: rejections as PlanFile['rejections'],
    ...(results ? { results } : {}),
  };
}

/**
 * Puts a plan into the planner, replacing what was there. `saved` says whether the plan equals a
 * file on disk (opened from one) or is unsaved work (restored from autosave). The undo history
 * starts afresh unless `keepHistory` (then the replacement is one undo step: see planReplace).
 * When `results` is given, the Results step takes the plan's results work (or starts empty when
 * the plan has none).
 */
export function planFileApply(store: PlannerStore, plan: PlanFile, defaults: DesignSettings, saved: boolean, results?: ResultsStore, keepHistory = false): void {
  const s = store.getState();
  const revision = s.revision + 1;
  store.setState({
    site: plan.site,
    design: { ...defaults, ...plan.design },
    result: plan.result,
    resultStale: false,
    rejections: plan.rejections,
    revision,
    savedRevision: saved ? revision : s.savedRevision,
    selection: null,
    tool: 'none',
  });
  if (!keepHistory) store.temporal.getState().clear();
  if (!results) return;
  if (plan.results) resultsSnapshotRestore(results, plan.results, plan.result);
  else resultsReset(results);
}

/** True when the planner holds changes not yet written to a plan file. */
export function planHasUnsavedWork(state: PlannerState): boolean {
  return state.revision !== state.savedRevision && (state.site.parts.length > 0 || state.result !== null);
}

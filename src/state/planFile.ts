import type { DesignSettings, PlotCollection } from '../core/model/designTypes';
import { PLAN_FILE_VERSION, type PlanFile, type PlanFileDocument, type ResultsSnapshot } from './planFileTypes';
import { InputError } from '../core/common/InputError';
import { FIELD_SETUP_EMPTY } from '../core/model/fieldTypes';
import { fieldSetupRead } from './fieldSetupRead';
import { plotVisitFieldsCheck } from '../io/plots/plotVisitFieldsCheck';
import { plotCollectionById, plotCollectionNamed } from '../core/field/plotCollectionNamed';
import type { Site, StratumInfo, StratumPart } from '../core/model/types';
import { planFileMigrateV1 } from './planFileMigrate';
import type { PlannerState, PlannerStore } from './plannerStore';
import { plannerPlotsNamed } from './plotsNamed';
import type { ResultsStore } from './resultsStore';
import { resultsReset, resultsSnapshotIsEmpty, resultsSnapshotParse, resultsSnapshotRestore } from './resultsSnapshot';

/** A plan holding a site and design settings and nothing else yet (no design, no results). */
export function planFileOf(site: Site, design: DesignSettings): PlanFile {
  return { format: 'stratplot-plan', version: PLAN_FILE_VERSION, savedAt: '', site, design, result: null };
}

/** The last named copy of each result, by result, with the strata it was named for. */
const named = new WeakMap<PlotCollection, { strata: StratumInfo[]; collection: PlanFileDocument['result'] }>();

/**
 * A result as the plan file writes it (plotCollectionNamed with ids), made once per result and
 * strata: the plan is written after every change, and naming 10,000 plots each time held the page up.
 */
function resultNamed(result: PlotCollection, strata: StratumInfo[]): PlanFileDocument['result'] {
  const kept = named.get(result);
  if (kept && kept.strata === strata) return kept.collection;
  const collection = plotCollectionNamed(result, strata, { ids: true });
  named.set(result, { strata, collection });
  return collection;
}

/**
 * The plan file for what the planner holds now (see ARCHITECTURE.md, "The plan file"): strata by
 * stable id with their current names and codes, the result named as a plot file (plus each plot's
 * `stratum_id`), its plots carrying their field state. Write it with JSON.stringify.
 * @param results the Results step's work; left out of the file when absent or empty
 */
export function planFileFromState(state: PlannerState, savedAt: string, results?: ResultsSnapshot | null): PlanFileDocument {
  const { strata, parts, ...site } = state.site;
  const plan: PlanFileDocument = {
    format: 'stratplot-plan',
    version: PLAN_FILE_VERSION,
    savedAt,
    site: {
      ...site,
      strata: strata.map((s) => ({ id: s.key, name: s.label, code: s.code, colour: s.colour })),
      parts: parts.map(({ stratum, ...p }) => ({ id: p.id, stratum_id: stratum, geometry: p.geometry, ...(p.properties ? { properties: p.properties } : {}) })),
    },
    design: state.design,
    result: state.result ? resultNamed(state.result, strata) : null,
  };
  if (state.field.crew || state.field.variables.length || state.field.arrivalRadiusM !== FIELD_SETUP_EMPTY.arrivalRadiusM) plan.field = state.field;
  if (results && !resultsSnapshotIsEmpty(results)) plan.results = results;
  return plan;
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function strataRead(strata: unknown[], fileName: string): StratumInfo[] {
  return strata.map((s, i) => {
    if (!isObject(s) || typeof s.id !== 'string' || s.id === '') throw new InputError(`${fileName}: site.strata[${i}] has no id`);
    const name = typeof s.name === 'string' && s.name.trim() ? s.name : s.id;
    if (typeof s.code !== 'string' || !s.code) throw new InputError(`${fileName}: site.strata[${i}] ("${name}") has no code`);
    return { key: s.id, label: name, code: s.code, colour: typeof s.colour === 'string' ? s.colour : '#777777' };
  });
}

function siteCheck(site: unknown, fileName: string): Site {
  if (!isObject(site)) throw new InputError(`${fileName}: "site" is missing or not an object`);
  for (const key of ['strata', 'parts', 'exclusions', 'access'] as const) {
    if (!Array.isArray(site[key])) throw new InputError(`${fileName}: site.${key} must be a list`);
  }
  const parts = (site.parts as unknown[]).map((p, i): StratumPart => {
    if (!isObject(p) || typeof p.stratum_id !== 'string' || !isObject(p.geometry)) {
      throw new InputError(`${fileName}: site.parts[${i}] needs a stratum_id and a geometry`);
    }
    const type = (p.geometry as { type?: unknown }).type;
    if (type !== 'Polygon' && type !== 'MultiPolygon') throw new InputError(`${fileName}: site.parts[${i}] geometry is ${String(type)}, not a polygon`);
    const part: StratumPart = { id: String(p.id ?? ''), stratum: p.stratum_id, geometry: p.geometry as unknown as StratumPart['geometry'] };
    if (isObject(p.properties)) part.properties = p.properties;
    return part;
  });
  return { ...(site as unknown as Site), strata: strataRead(site.strata as unknown[], fileName), parts };
}

/**
 * Reads a plan file's text into the plan the planner holds. Version 1 files (saved before strata
 * had separate ids and names and before field decisions lived on the plots alone) are migrated
 * first (planFileMigrateV1). Throws InputError naming the file when it is not JSON, not a
 * stratplot plan, of a newer version than this program reads, or missing its site or design.
 * A plan saved before random generator versions were recorded gets version 1, the streams it was
 * made with, so running its design again gives the same plots.
 */
export function planFileParse(text: string, fileName: string): PlanFile {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    throw new InputError(`${fileName}: not valid JSON (${(e as Error).message})`);
  }
  if (!isObject(data) || data.format !== 'stratplot-plan') throw new InputError(`${fileName}: not a stratplot plan file (no "format": "stratplot-plan")`);
  if (data.version === 1) data = planFileMigrateV1(data, fileName);
  if (!isObject(data) || data.version !== PLAN_FILE_VERSION) {
    const v = isObject(data) ? data.version : undefined;
    throw new InputError(`${fileName}: plan version ${String(v)} is not one this program reads (it reads versions 1 to ${PLAN_FILE_VERSION})`);
  }
  const site = siteCheck(data.site, fileName);
  if (!isObject(data.design)) throw new InputError(`${fileName}: "design" settings are missing`);
  const result = data.result ?? null;
  if (result !== null && (!isObject(result) || !Array.isArray(result.features))) throw new InputError(`${fileName}: "result" is not a plot collection`);
  const field = data.field === undefined || data.field === null ? undefined : fieldSetupRead(data.field, fileName);
  if (result !== null) plotVisitFieldsCheck((result as { features: unknown[] }).features, fileName);
  const results = data.results === undefined || data.results === null ? undefined : resultsSnapshotParse(data.results, fileName);
  return {
    format: 'stratplot-plan',
    version: PLAN_FILE_VERSION,
    savedAt: typeof data.savedAt === 'string' ? data.savedAt : '',
    site,
    design: { ...(data.design as unknown as DesignSettings), rngVersion: (data.design.rngVersion as DesignSettings['rngVersion']) ?? 1 },
    result: result === null ? null : plotCollectionById(result as unknown as NonNullable<PlanFile['result']>),
    ...(field ? { field } : {}),
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
    field: plan.field ?? FIELD_SETUP_EMPTY,
    resultStale: false,
    revision,
    savedRevision: saved ? revision : s.savedRevision,
    selection: null,
    tool: 'none',
  });
  if (!keepHistory) store.temporal.getState().clear();
  if (!results) return;
  if (plan.results) resultsSnapshotRestore(results, plan.results, plannerPlotsNamed(store.getState()));
  else resultsReset(results);
}

/** True when the planner holds changes not yet written to a plan file. */
export function planHasUnsavedWork(state: PlannerState): boolean {
  return state.revision !== state.savedRevision && (state.site.parts.length > 0 || state.result !== null);
}

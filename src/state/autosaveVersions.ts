import { countNoun } from '../core/common/countNoun';
import type { PlanFile, PlanFileDocument } from './planFileTypes';
import { plotRejections } from '../core/field/plotFieldState';
import { InputError } from '../core/common/InputError';
import { sha256Hex } from '../core/common/sha256';
import { planFileParse } from './planFile';
import { jsonPiecesKeepingGeometry, jsonStringifyKeepingGeometry } from '../io/common/jsonStringifyKeepingGeometry';
import { type PlanRecord, planRecordHashText, planRecordText } from '../io/common/planRecordText';

/** The key-value calls the kept versions need (idb-keyval's get/set/del in the browser). */
export interface VersionStorage {
  get(key: string): Promise<unknown>;
  set(key: string, value: unknown): Promise<void>;
  del?(key: string): Promise<void>;
  /**
   * SHA-256 of a text's UTF-8 bytes as hex, done away from the caller's thread (the browser's
   * storage worker); without it the hash is computed here with sha256Hex.
   */
  textSha256?(text: string): Promise<string>;
  /**
   * Stores under `key` the text of a record (planRecordText), put together where the storage is
   * (the browser's storage worker, so the page hands over the one hash text); without it the
   * text is put together here and stored with `set`.
   */
  setRecord?(key: string, record: PlanRecord): Promise<void>;
  /** SHA-256 of a record's hash text as hex, done where the storage holds it; else textSha256 of the joined text. */
  recordSha256?(record: PlanRecord): Promise<string>;
}

/** Key of the list of kept versions; each version's plan is under this key plus ":" and its id. */
export const VERSIONS_KEY = 'stratplot:earlier-work';

/** One kept version of the work, newest first in the list. */
export interface WorkVersion {
  id: string;
  /** When it was last written (ISO 8601). */
  at: string;
  /** When this version was begun (ISO 8601). */
  since: string;
  siteName: string;
  /** What it holds, in words: strata, exclusions, design, field decisions, results. */
  summary: string;
  /** SHA-256 of the plan without its save time: versions with the same work are kept once. */
  hash: string;
  /** Which plan and browser session it was written from. */
  slot: string;
}

/** A plan as the planner holds it or as it is written to a file. */
type KeptPlan = PlanFile | PlanFileDocument;

/** What a plan holds, in a few words (for the list of kept versions). */
function planSummary(plan: KeptPlan): string {
  const s = plan.site;
  const parts = [countNoun(s.strata.length, 'stratum', 'strata'), countNoun(s.exclusions.length, 'exclusion'), countNoun(s.access.length, 'access point')];
  const out = [parts.join(', ')];
  if (plan.result) {
    const primaries = plan.result.features.filter((f) => f.properties.role === 'primary').length;
    out.push(`design of ${countNoun(primaries, 'primary plot')}`);
  } else out.push('no design yet');
  const rejected = plan.result ? plotRejections(plan.result).length : 0;
  if (rejected) out.push(`${countNoun(rejected, 'plot')} rejected`);
  if (plan.results?.csvText) out.push(`results from ${plan.results.fileName ?? 'a file'}`);
  return out.join('; ');
}

async function indexRead(storage: VersionStorage): Promise<WorkVersion[]> {
  const raw = await storage.get(VERSIONS_KEY);
  if (typeof raw !== 'string') return [];
  try {
    const list = JSON.parse(raw);
    return Array.isArray(list) ? (list.filter((v) => v && typeof v.id === 'string' && typeof v.at === 'string') as WorkVersion[]) : [];
  } catch {
    return [];
  }
}

/** The kept versions, newest first. */
export function workVersionsList(storage: VersionStorage): Promise<WorkVersion[]> {
  return indexRead(storage);
}

/**
 * Reads one kept version back as a plan, with whether it had been saved to a file. Throws
 * InputError when it is gone or cannot be read.
 */
export async function workVersionRead(storage: VersionStorage, id: string): Promise<{ plan: PlanFile; saved: boolean }> {
  const raw = await storage.get(`${VERSIONS_KEY}:${id}`);
  if (typeof raw !== 'string') throw new InputError('that earlier version is no longer kept in this browser');
  let record: { plan?: unknown; saved?: unknown };
  try {
    record = JSON.parse(raw);
  } catch {
    throw new InputError('that earlier version is damaged and could not be read');
  }
  return { plan: planFileParse(JSON.stringify(record.plan), 'the earlier version'), saved: record.saved === true };
}

/**
 * The text a version's content hash is taken of: the plan's JSON without the time it was written,
 * characters above Latin-1 escaped (the compact text that crosses to the storage worker quickly).
 */
export function planHashText(plan: KeptPlan): string {
  return jsonStringifyKeepingGeometry({ ...plan, savedAt: '' });
}

/** planHashText as the pieces it is joined from (see jsonPiecesKeepingGeometry), for a PlanRecord. */
export function planHashTextPieces(plan: KeptPlan): string[] {
  return jsonPiecesKeepingGeometry({ ...plan, savedAt: '' });
}

/** The content hash a version is compared by: SHA-256 (FIPS 180-4) of planHashText, hex. */
export async function planHash(storage: VersionStorage, hashText: string): Promise<string> {
  return storage.textSha256 ? storage.textSha256(hashText) : sha256Hex(hashText);
}

/** planHash of a record's hash text, taken where the storage holds it when it can (recordSha256). */
function planRecordHash(storage: VersionStorage, record: PlanRecord): Promise<string> {
  return storage.recordSha256 ? storage.recordSha256(record) : planHash(storage, planRecordHashText(record));
}

/** Stores a record under `key`: a text as it is, a record's parts put together by the storage (setRecord) or here. */
export function planRecordSet(storage: VersionStorage, key: string, record: PlanRecord | string): Promise<void> {
  if (typeof record === 'string') return storage.set(key, record);
  return storage.setRecord ? storage.setRecord(key, record) : storage.set(key, planRecordText(record));
}

/**
 * Keeps the last `max` versions of the work. Each write replaces the newest version while it is the
 * same plan in the same session and younger than `windowMs`; otherwise (another plan opened, a new
 * session, time passed) the newest is kept as it is and a new version begins. A version whose work
 * equals an older one replaces it, so the same work is listed once (at its latest time).
 */
export function workVersionsKeeper(storage: VersionStorage, max = 10, windowMs = 10 * 60_000) {
  let index: WorkVersion[] | null = null;
  const remove = (id: string) => (storage.del ? storage.del(`${VERSIONS_KEY}:${id}`) : storage.set(`${VERSIONS_KEY}:${id}`, null));
  /**
   * Keeps `record` (a stored text, or a record's parts: see planRecordSet) as a version of `plan`;
   * `hashText` (planHashText of the plan) when the caller has it already (a record carries its own).
   */
  return async function keep(record: PlanRecord | string, plan: KeptPlan, slot: string, now: Date, hashText?: string): Promise<void> {
    index ??= await indexRead(storage);
    const hash = await (typeof record === 'string' ? planHash(storage, hashText ?? planHashText(plan)) : planRecordHash(storage, record));
    const at = now.toISOString();
    const head = index[0];
    if (head && head.hash === hash) {
      index = [{ ...head, at }, ...index.slice(1)];
      await storage.set(VERSIONS_KEY, JSON.stringify(index));
      return;
    }
    const continues = head && head.slot === slot && now.getTime() - Date.parse(head.since) < windowMs;
    const taken = new Set(index.map((v) => v.id));
    let id = continues ? head.id : `v${now.getTime()}`;
    for (let n = 2; !continues && taken.has(id); n++) id = `v${now.getTime()}-${n}`;
    const rest = (continues ? index.slice(1) : index).filter((v) => v.hash !== hash);
    const dropped = (continues ? index.slice(1) : index).filter((v) => v.hash === hash);
    const entry: WorkVersion = { id, at, since: continues ? head.since : at, siteName: plan.site.name, summary: planSummary(plan), hash, slot };
    const all = [entry, ...rest];
    await planRecordSet(storage, `${VERSIONS_KEY}:${id}`, record);
    index = all.slice(0, max);
    await storage.set(VERSIONS_KEY, JSON.stringify(index));
    for (const v of [...dropped, ...all.slice(max)]) await remove(v.id);
  };
}

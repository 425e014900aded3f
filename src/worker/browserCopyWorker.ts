import * as Comlink from 'comlink';
import { del, get, set } from 'idb-keyval';
import { type PlanRecord, type PlanRecordDelta, planRecordFromDelta, planRecordHashText, planRecordText } from '../io/common/planRecordText';

function hex(bytes: ArrayBuffer): string {
  return Array.from(new Uint8Array(bytes), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** The value of the last set or setRecord call (setLast stores it again). */
let last: unknown = null;

/** The last setRecord call's record (lastRecordSha256 hashes its hash text). */
let lastRecord: PlanRecord | null = null;

async function textSha256(text: string): Promise<string> {
  return hex(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(text)));
}

/**
 * The browser copy of the work (IndexedDB, idb-keyval's default store) and its content hashes,
 * kept off the page's thread: writing a 40 MB plan into IndexedDB and hashing it held the page up
 * for seconds on a million-vertex map, while handing this worker the text costs milliseconds.
 */
const api = {
  get(key: string): Promise<unknown> {
    return get(key);
  },
  set(key: string, value: unknown): Promise<void> {
    last = value;
    return set(key, value);
  },
  /**
   * Puts a record's text together here (planRecordText) and stores it under `key`; the pieces it
   * shares with the previous record come from that record (planRecordDelta).
   */
  setRecord(key: string, delta: PlanRecordDelta): Promise<void> {
    const record = planRecordFromDelta(delta, lastRecord?.hashTextPieces ?? []);
    last = planRecordText(record);
    lastRecord = record;
    return set(key, last);
  },
  /** Stores under `key` the value of the last set or setRecord call again (the working plan and its version share one text). */
  setLast(key: string): Promise<void> {
    return set(key, last);
  },
  del(key: string): Promise<void> {
    return del(key);
  },
  /** SHA-256 (FIPS 180-4, by the platform's Web Crypto) of the text's UTF-8 bytes, hex. */
  textSha256,
  /** textSha256 of the last setRecord call's hash text, which the page need not send again. */
  lastRecordSha256(): Promise<string> {
    return textSha256(lastRecord ? planRecordHashText(lastRecord) : '');
  },
};

/** The browser copy's interface as the page sees it through comlink. */
export type BrowserCopyWorkerApi = typeof api;

Comlink.expose(api);

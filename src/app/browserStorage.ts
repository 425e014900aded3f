import * as Comlink from 'comlink';
import { del, get, set } from 'idb-keyval';
import { sha256Hex } from '../core/common/sha256';
import { type PlanRecord, planRecordDelta, planRecordHashText, planRecordText } from '../io/common/planRecordText';
import type { AutosaveStorage } from '../state/autosave';
import type { BrowserCopyWorkerApi } from '../worker/browserCopyWorker';

let remote: Comlink.Remote<BrowserCopyWorkerApi> | null = null;
let workerFailed: Promise<void> | null = null;
let failed = false;

/** The one browser-copy worker, started on first use; null once it has failed to start. */
function worker(): Comlink.Remote<BrowserCopyWorkerApi> | null {
  if (failed) return null;
  if (!remote) {
    const w = new Worker(new URL('../worker/browserCopyWorker.ts', import.meta.url), { type: 'module', name: 'stratplot-browser-copy' });
    workerFailed = new Promise((resolve) =>
      w.addEventListener('error', () => {
        failed = true;
        resolve();
      }),
    );
    remote = Comlink.wrap<BrowserCopyWorkerApi>(w);
  }
  return remote;
}

/**
 * Through the worker, or here on the page when the worker could not start (a call waiting on a
 * worker that never answers would hold up the planner's start and every save).
 */
function call<T>(viaWorker: (w: Comlink.Remote<BrowserCopyWorkerApi>) => Promise<T>, here: () => Promise<T>): Promise<T> {
  const w = worker();
  if (!w || !workerFailed) return here();
  return Promise.race([viaWorker(w), workerFailed.then(here)]);
}

/**
 * The value of the last set or setRecord call: a plan's record is written twice in a row (working
 * copy, version) and crosses once, and its hash text is hashed where it already is (the worker).
 */
let lastSet: unknown = null;
let lastRecord: PlanRecord | null = null;
/** The pieces of the last record handed to the worker, which it holds (see planRecordDelta). */
let sentPieces: readonly string[] = [];

/** This browser's IndexedDB (idb-keyval's default store): the working plan and its earlier versions, written by a worker. */
export const browserStorage: AutosaveStorage = {
  get: (k) => call((w) => w.get(k), () => get(k)),
  set: (k, v) => {
    const again = typeof v === 'string' && v.length > 1 << 16 && v === lastSet;
    lastSet = v;
    lastRecord = null;
    return call((w) => (again ? w.setLast(k) : w.set(k, v)), () => set(k, v));
  },
  setRecord: (k, record) => {
    const again = record === lastRecord;
    lastRecord = record;
    lastSet = null;
    return call(
      (w) => {
        if (again) return w.setLast(k);
        const delta = planRecordDelta(record, sentPieces);
        sentPieces = record.hashTextPieces;
        return w.setRecord(k, delta);
      },
      () => set(k, planRecordText(record)),
    );
  },
  del: (k) => call((w) => w.del(k), () => del(k)),
  textSha256: (text) => call((w) => w.textSha256(text), async () => sha256Hex(text)),
  recordSha256: (record) => {
    const held = record === lastRecord;
    return call((w) => (held ? w.lastRecordSha256() : w.textSha256(planRecordHashText(record))), async () => sha256Hex(planRecordHashText(record)));
  },
};

import * as Comlink from 'comlink';
import { del, get, set } from 'idb-keyval';
import { sha256Hex } from '../core/common/sha256';
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

/** The value of the last set call: a plan's text is written twice in a row (working copy, version) and crosses once. */
let lastSet: unknown = null;

/** This browser's IndexedDB (idb-keyval's default store): the working plan and its earlier versions, written by a worker. */
export const browserStorage: AutosaveStorage = {
  get: (k) => call((w) => w.get(k), () => get(k)),
  set: (k, v) => {
    const again = typeof v === 'string' && v.length > 1 << 16 && v === lastSet;
    lastSet = v;
    return call((w) => (again ? w.setLast(k) : w.set(k, v)), () => set(k, v));
  },
  del: (k) => call((w) => w.del(k), () => del(k)),
  textSha256: (text) => call((w) => w.textSha256(text), async () => sha256Hex(text)),
};

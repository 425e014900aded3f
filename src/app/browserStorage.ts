import * as Comlink from 'comlink';
import type { AutosaveStorage } from '../state/autosave';
import type { BrowserCopyWorkerApi } from '../worker/browserCopyWorker';

let remote: Comlink.Remote<BrowserCopyWorkerApi> | null = null;

/** The one browser-copy worker, started on first use. */
function worker(): Comlink.Remote<BrowserCopyWorkerApi> {
  remote ??= Comlink.wrap<BrowserCopyWorkerApi>(new Worker(new URL('../worker/browserCopyWorker.ts', import.meta.url), { type: 'module', name: 'stratplot-browser-copy' }));
  return remote;
}

/** The value of the last set call: a plan's text is written twice in a row (working copy, version) and crosses once. */
let lastSet: unknown = null;

/** This browser's IndexedDB (idb-keyval's default store): the working plan and its earlier versions, written by a worker. */
export const browserStorage: AutosaveStorage = {
  get: (k) => worker().get(k),
  set: (k, v) => {
    if (typeof v === 'string' && v.length > 1 << 16 && v === lastSet) return worker().setLast(k);
    lastSet = v;
    return worker().set(k, v);
  },
  del: (k) => worker().del(k),
  textSha256: (text) => worker().textSha256(text),
};

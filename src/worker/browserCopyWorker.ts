import * as Comlink from 'comlink';
import { del, get, set } from 'idb-keyval';

function hex(bytes: ArrayBuffer): string {
  return Array.from(new Uint8Array(bytes), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** The value of the last set call (setLast stores it again). */
let last: unknown = null;

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
  /** Stores under `key` the value of the last set call again (the working plan and its version share one text). */
  setLast(key: string): Promise<void> {
    return set(key, last);
  },
  del(key: string): Promise<void> {
    return del(key);
  },
  /** SHA-256 (FIPS 180-4, by the platform's Web Crypto) of the text's UTF-8 bytes, hex. */
  async textSha256(text: string): Promise<string> {
    return hex(await crypto.subtle.digest('SHA-256', new TextEncoder().encode(text)));
  },
};

/** The browser copy's interface as the page sees it through comlink. */
export type BrowserCopyWorkerApi = typeof api;

Comlink.expose(api);

import { del, get, set } from 'idb-keyval';
import type { AutosaveStorage } from '../state/autosave';

/** This browser's IndexedDB (idb-keyval's default store): the working plan and its earlier versions. */
export const browserStorage: AutosaveStorage = { get: (k) => get(k), set: (k, v) => set(k, v), del: (k) => del(k) };

import type { DesignSettings, PlanFile } from '../core/designTypes';
import { InputError } from '../core/InputError';
import { planFileApply, planFileFromState, planFileParse } from './planFile';
import type { PlannerStore } from './plannerStore';

/** The two calls autosave needs from a key-value store (idb-keyval's get/set in the browser). */
export interface AutosaveStorage {
  get(key: string): Promise<unknown>;
  set(key: string, value: unknown): Promise<void>;
}

/** Key under which the working plan is kept in IndexedDB. */
export const AUTOSAVE_KEY = 'stratplot:working-plan';

/** What is kept: the plan plus whether it had been written to a file. */
interface AutosaveRecord {
  plan: PlanFile;
  saved: boolean;
}

/**
 * Writes the working plan to storage after every change (site, design, result, field decisions),
 * coalescing bursts into one write per `delayMs`. Returns `flush` (write a pending change now, e.g.
 * when the page is being hidden or closed) and `stop` (stop autosave after flushing).
 */
export function autosaveStart(
  store: PlannerStore,
  storage: AutosaveStorage,
  delayMs = 250,
  onError?: (e: unknown) => void,
): { flush: () => Promise<void>; stop: () => Promise<void> } {
  let timer: ReturnType<typeof setTimeout> | null = null;
  let writing: Promise<void> = Promise.resolve();
  const write = () => {
    timer = null;
    const s = store.getState();
    const record: AutosaveRecord = { plan: planFileFromState(s, new Date().toISOString()), saved: s.revision === s.savedRevision };
    writing = writing.then(() => storage.set(AUTOSAVE_KEY, JSON.stringify(record))).catch((e) => onError?.(e));
  };
  const unsubscribe = store.subscribe((s, prev) => {
    if (s.site === prev.site && s.design === prev.design && s.result === prev.result && s.rejections === prev.rejections && s.savedRevision === prev.savedRevision) return;
    if (timer === null) timer = setTimeout(write, delayMs);
  });
  const flush = async () => {
    if (timer !== null) {
      clearTimeout(timer);
      write();
    }
    await writing;
  };
  return {
    flush,
    stop: async () => {
      unsubscribe();
      await flush();
    },
  };
}

/**
 * Restores the working plan kept by {@link autosaveStart}; returns false when there is none.
 * A damaged record is reported through the thrown InputError rather than half-loaded.
 */
export async function autosaveRestore(store: PlannerStore, storage: AutosaveStorage, defaults: DesignSettings): Promise<boolean> {
  const raw = await storage.get(AUTOSAVE_KEY);
  if (typeof raw !== 'string') return false;
  let record: AutosaveRecord;
  try {
    record = JSON.parse(raw) as AutosaveRecord;
  } catch {
    throw new InputError('the browser copy of your work is damaged and could not be read');
  }
  const plan = planFileParse(JSON.stringify(record.plan), 'the browser copy of your work');
  planFileApply(store, plan, defaults, record.saved);
  return true;
}

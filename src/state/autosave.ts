import type { DesignSettings } from '../core/model/designTypes';
import type { PlanFile, PlanFileDocument } from './planFileTypes';
import { InputError } from '../core/common/InputError';
import { planFileApply, planFileFromState, planFileParse } from './planFile';
import type { PlannerStore } from './plannerStore';
import type { ResultsStore } from './resultsStore';
import { RESULTS_SNAPSHOT_FIELDS, resultsSnapshotTake } from './resultsSnapshot';
import { planHashTextPieces, planRecordSet, type VersionStorage, workVersionsKeeper } from './autosaveVersions';
import { jsonStringifyKeepingGeometry } from '../io/common/jsonStringifyKeepingGeometry';
import type { PlanRecord } from '../io/common/planRecordText';

/** The calls autosave needs from a key-value store: those of the kept versions (VersionStorage). */
export type AutosaveStorage = VersionStorage;

/** Key under which the working plan is kept in IndexedDB. */
export const AUTOSAVE_KEY = 'stratplot:working-plan';

/** Key under which a browser copy that could not be read is set aside (never overwritten by new work). */
export const AUTOSAVE_UNREADABLE_KEY = 'stratplot:unreadable-copy';

/** What is kept: the plan plus whether it had been written to a file. */
interface AutosaveRecord {
  plan: PlanFileDocument;
  saved: boolean;
}

/** Waits for the next task (letting the page draw), or only for the microtask queue when `urgent`. */
function pause(urgent: boolean): Promise<void> {
  return urgent ? Promise.resolve() : new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * Writes the working plan to storage after every change (site, design, result, field decisions),
 * coalescing bursts into one write per `delayMs`. Returns `flush` (write a pending change now, e.g.
 * when the page is being hidden or closed) and `stop` (stop autosave after flushing). With `results`,
 * the Results step's work (file, mapping, options, recapture forms) is kept too, on its own changes.
 * Besides the working plan, the last several versions are kept (see workVersionsKeeper): each plan
 * opened and each session begins a new one.
 */
export function autosaveStart(
  store: PlannerStore,
  storage: AutosaveStorage,
  delayMs = 250,
  onError?: (e: unknown) => void,
  results?: ResultsStore,
): { flush: () => Promise<void>; stop: () => Promise<void> } {
  let timer: ReturnType<typeof setTimeout> | null = null;
  let writing: Promise<void> = Promise.resolve();
  const keep = workVersionsKeeper(storage);
  const session = new Date().toISOString();
  const write = (urgent = false) => {
    timer = null;
    const s = store.getState();
    const now = new Date();
    const snapshot = results ? resultsSnapshotTake(results.getState()) : null;
    const saved = s.revision === s.savedRevision;
    const slot = `${session}#${s.planOpened.serial}`;
    writing = writing
      .then(async () => {
        // The steps run as separate tasks so the page can draw between them (on a 10,000-plot
        // design each takes tens of milliseconds); a flush runs them at once.
        const plan = planFileFromState(s, '', snapshot);
        await pause(urgent);
        // A new design's plots are written on their own first (the text is kept with them), then
        // the whole plan is put together from kept texts.
        if (plan.result) jsonStringifyKeepingGeometry(plan.result);
        await pause(urgent);
        // One text of the plan serves both the content hash (without the save time) and the
        // record, which only adds the save time at its head: the storage puts it together.
        const savedAt = now.toISOString();
        const record: PlanRecord = { hashTextPieces: planHashTextPieces(plan), savedAt, saved };
        await pause(urgent);
        await planRecordSet(storage, AUTOSAVE_KEY, record);
        await keep(record, { ...plan, savedAt }, slot, now);
      })
      .catch((e) => onError?.(e));
  };
  const unsubscribe = store.subscribe((s, prev) => {
    if (s.site === prev.site && s.design === prev.design && s.result === prev.result && s.field === prev.field && s.savedRevision === prev.savedRevision && s.planOpened === prev.planOpened) return;
    if (timer === null) timer = setTimeout(() => write(), delayMs);
  });
  const unsubscribeResults = results?.subscribe((s, prev) => {
    if (RESULTS_SNAPSHOT_FIELDS.every((k) => s[k] === prev[k])) return;
    if (timer === null) timer = setTimeout(() => write(), delayMs);
  });
  const flush = async () => {
    if (timer !== null) {
      clearTimeout(timer);
      write(true);
    }
    await writing;
  };
  return {
    flush,
    stop: async () => {
      unsubscribe();
      unsubscribeResults?.();
      await flush();
    },
  };
}

/**
 * Restores the working plan kept by {@link autosaveStart}; returns false when there is none.
 * A damaged record (or one written by a newer version) is not half-loaded: it is set aside under
 * {@link AUTOSAVE_UNREADABLE_KEY}, where new work never overwrites it, and the thrown InputError
 * says why. With `results`, the Results step's kept work is restored as well.
 */
export async function autosaveRestore(store: PlannerStore, storage: AutosaveStorage, defaults: DesignSettings, results?: ResultsStore): Promise<boolean> {
  const raw = await storage.get(AUTOSAVE_KEY);
  if (typeof raw !== 'string') return false;
  let plan: PlanFile;
  let record: AutosaveRecord;
  try {
    try {
      record = JSON.parse(raw) as AutosaveRecord;
    } catch {
      throw new InputError('the browser copy of your work is damaged and could not be read');
    }
    plan = planFileParse(JSON.stringify(record.plan), 'the browser copy of your work');
  } catch (error) {
    await storage.set(AUTOSAVE_UNREADABLE_KEY, raw);
    throw error;
  }
  planFileApply(store, plan, defaults, record.saved, results);
  return true;
}

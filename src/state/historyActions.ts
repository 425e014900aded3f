import type { PlannerStore } from './plannerStore';
import { stratumPartRemove } from './strataActions';
import { exclusionRemove } from './exclusionActions';
import { accessRemove } from './accessActions';

function step(store: PlannerStore, move: 'undo' | 'redo'): boolean {
  const history = store.temporal.getState();
  const available = move === 'undo' ? history.pastStates.length : history.futureStates.length;
  if (available === 0) return false;
  history[move]();
  const s = store.getState();
  // The restored site is an older object: count it as a change so autosave and staleness follow.
  store.temporal.getState().pause();
  store.setState({ revision: s.revision + 1, resultStale: s.result !== null, selection: null });
  store.temporal.getState().resume();
  return true;
}

/** Steps back one site edit; returns false when there is nothing to undo. */
export function historyUndo(store: PlannerStore): boolean {
  return step(store, 'undo');
}

/** Steps forward one undone site edit; returns false when there is nothing to redo. */
export function historyRedo(store: PlannerStore): boolean {
  return step(store, 'redo');
}

/** Deletes whatever is selected on the map (a stratum feature, an exclusion or an access point). */
export function selectionRemove(store: PlannerStore): boolean {
  const sel = store.getState().selection;
  if (!sel) return false;
  if (sel.kind === 'part') stratumPartRemove(store, sel.id);
  else if (sel.kind === 'exclusion') exclusionRemove(store, sel.id);
  else if (sel.kind === 'access') accessRemove(store, sel.id);
  else return false;
  return true;
}

import { planChangeDescribe, type PlanChange } from './planChangeDescribe';
import { PLANNER_STEPS, type PlannerPlan, type PlannerStore, plannerPlanOf } from './plannerStore';
import type { ResultsStore } from './resultsStore';
import { resultsReset, resultsSnapshotRestore } from './resultsSnapshot';
import { stratumPartRemove } from './strataActions';
import { exclusionRemove } from './exclusionActions';
import { accessRemove } from './accessActions';

type Move = 'undo' | 'redo';

function target(store: PlannerStore, move: Move): PlannerPlan | undefined {
  const history = store.temporal.getState();
  const list = move === 'undo' ? history.pastStates : history.futureStates;
  return list[list.length - 1] as PlannerPlan | undefined;
}

/**
 * What Undo (or Redo) would take back (or do again), in words, with its step; null when there is
 * nothing to undo (redo).
 */
export function historyNext(store: PlannerStore, move: Move): PlanChange | null {
  const next = target(store, move);
  if (!next) return null;
  const now = plannerPlanOf(store.getState());
  return move === 'undo' ? planChangeDescribe(next, now) : planChangeDescribe(now, next);
}

/** The notice after an undo or redo: what was taken back or done again, and on which step. */
function historyNoticeText(move: Move, change: PlanChange): string {
  const verb = move === 'undo' ? 'Undone' : 'Redone';
  const at = change.step ? PLANNER_STEPS.findIndex((s) => s.id === change.step) : -1;
  const where = at >= 0 ? ` in step ${at + 1}, ${PLANNER_STEPS[at].label}` : '';
  const after = change.step === null && move === 'undo' ? ' The plan you had before is back.' : '';
  return `${verb}${where}: ${change.text}.${after}`;
}

function step(store: PlannerStore, move: Move, results?: ResultsStore): boolean {
  const next = target(store, move);
  if (!next) return false;
  const before = store.getState();
  const change = historyNext(store, move) as PlanChange;
  store.temporal.getState()[move]();
  const s = store.getState();
  // Crossing into another plan: its Results work comes back with it.
  if (results && before.planOpened !== s.planOpened) {
    if (s.resultsKept) resultsSnapshotRestore(results, s.resultsKept, s.result);
    else resultsReset(results);
  }
  // The restored plan is older objects: count it as a change so autosave follows; show the step it is on.
  store.temporal.getState().pause();
  store.setState({
    revision: s.revision + 1,
    selection: null,
    tool: 'none',
    step: change.step ?? s.step,
    notice: { tone: 'info', text: historyNoticeText(move, change) },
  });
  store.temporal.getState().resume();
  return true;
}

/**
 * Takes back the last change of the plan, whichever step it was made on: map edits, design
 * settings, the design made, field decisions, another plan opened. The notice says what was undone
 * and the planner shows that step. With `results`, undoing a plan replacement brings back the
 * Results step's work too. Returns false when there is nothing to undo.
 */
export function historyUndo(store: PlannerStore, results?: ResultsStore): boolean {
  return step(store, 'undo', results);
}

/** Makes the last undone change again (see {@link historyUndo}); false when there is nothing to redo. */
export function historyRedo(store: PlannerStore, results?: ResultsStore): boolean {
  return step(store, 'redo', results);
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

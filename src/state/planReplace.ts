import type { DesignSettings } from '../core/model/designTypes';
import type { PlanFile } from './planFileTypes';
import { planFileApply } from './planFile';
import type { PlannerState, PlannerStore } from './plannerStore';
import type { ResultsStore } from './resultsStore';
import { resultsSnapshotTake } from './resultsSnapshot';

function quiet(store: PlannerStore, patch: Partial<PlannerState>): void {
  store.temporal.getState().pause();
  store.setState(patch);
  store.temporal.getState().resume();
}

/**
 * Puts another plan in place of the one on screen (Open plan, Demo site, a kept version) as one
 * undo step: Undo brings back the plan that was there, with its Results work when `results` is
 * given. `what` names the plan in the notice and in the undo message ("the invented demo site",
 * a file name). `saved` as in planFileApply.
 */
export function planReplace(store: PlannerStore, plan: PlanFile, defaults: DesignSettings, what: string, saved: boolean, results?: ResultsStore): void {
  const before = store.getState();
  // The leaving plan keeps its Results work in its own history entry.
  quiet(store, { resultsKept: results ? resultsSnapshotTake(results.getState()) : null });
  planFileApply(store, plan, defaults, saved, results, true);
  quiet(store, {
    planOpened: { what, serial: before.planOpened.serial + 1 },
    resultsKept: plan.results ?? null,
    step: 'strata',
    notice: { tone: 'info', text: `Opened ${what}. Undo brings back the plan you had.` },
  });
}

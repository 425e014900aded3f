import { countNoun } from '../core/common/countNoun';
import * as Comlink from 'comlink';
import { designResultSet } from '../state/designActions';
import { plannerStore } from './plannerStoreInstance';
import { plannerWorkerStart } from './siteAnalysisRunner';
import { siteSourceFor } from './siteHandOver';

let running: { worker: Worker } | null = null;

/**
 * Runs the current design in a fresh worker, with progress in `job`. The result replaces the
 * previous one; a user-facing problem (e.g. too few plots for the strata) goes to the notice line.
 */
export async function designJobStart(): Promise<void> {
  if (running) return;
  const { site, design } = plannerStore.getState();
  const { api, worker } = plannerWorkerStart();
  running = { worker };
  plannerStore.setState({ job: { fraction: 0, stage: 'starting' }, notice: null });
  try {
    const outcome = await api.design(
      siteSourceFor(site),
      design,
      Comlink.proxy((fraction: number, stage: string) => {
        if (running?.worker === worker) plannerStore.setState({ job: { fraction, stage } });
      }),
    );
    // The plots arrive in one task (unpacking them, and the collection that follows) and are drawn
    // and listed in the next, so neither holds the page up as long as both would.
    await new Promise((resolve) => setTimeout(resolve, 0));
    if (running?.worker !== worker) return;
    if (outcome.ok) {
      designResultSet(plannerStore, outcome.collection);
      const n = outcome.collection.features.length;
      plannerStore.setState({ notice: { tone: 'info', text: `Design made: ${countNoun(n, 'plot')} (primaries and reserves), seed ${outcome.collection.design.seed}.` } });
    } else {
      plannerStore.setState({ job: null, notice: { tone: 'error', text: outcome.message } });
    }
  } catch (e) {
    if (running?.worker === worker) plannerStore.setState({ job: null, notice: { tone: 'error', text: `The design could not be made: ${(e as Error).message}` } });
  } finally {
    if (running?.worker === worker) running = null;
    worker.terminate();
  }
}

/** Stops a running design at once (the worker is discarded); the previous result stays. */
export function designJobCancel(): void {
  if (!running) return;
  running.worker.terminate();
  running = null;
  plannerStore.setState({ job: null, notice: { tone: 'info', text: 'Design cancelled; the previous plots are unchanged.' } });
}

import { useStore } from 'zustand';
import { InputError } from '../../core/common/InputError';
import { type PlotCheckRunner, type PlotCheckState, plotCheckRun, plotCheckStoreCreate } from '../../state/plotCheckStore';
import { plannerStore } from '../plannerStoreInstance';
import { plannerWorkerStart } from '../siteAnalysisRunner';
import { siteSourceFor } from '../siteHandOver';

/** The page's one plot-check store (its own slice: checked plots are not part of the plan or its undo history). */
export const plotCheckStore = plotCheckStoreCreate(plannerStore.getState().design);

/** Reads a slice of the plot-check store in a component, re-rendering when it changes. */
export function usePlotCheck<T>(select: (s: PlotCheckState) => T): T {
  return useStore(plotCheckStore, select);
}

/** Runs a check in a fresh planner worker, so a large set never holds up the page. */
export const plotCheckRunInWorker: PlotCheckRunner = async (site, plots, options) => {
  const { api, worker } = plannerWorkerStart();
  try {
    const out = await api.check(siteSourceFor(site), plots, options);
    if (!out.ok) throw new InputError(out.message);
    return out.report;
  } finally {
    worker.terminate();
  }
};

/**
 * Keeps the check in step with the plan: when the site changes (an exclusion moved, a stratum
 * renamed), loaded plots are checked again, so the report never describes a site that is gone.
 * Returns an unsubscribe function.
 */
export function plotCheckFollowSite(): () => void {
  let timer: ReturnType<typeof setTimeout> | null = null;
  const off = plannerStore.subscribe((s, prev) => {
    if (s.site === prev.site || !plotCheckStore.getState().plots) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => void plotCheckRun(plotCheckStore, plannerStore.getState().site, plotCheckRunInWorker), 300);
  });
  return () => {
    if (timer) clearTimeout(timer);
    off();
  };
}

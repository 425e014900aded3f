import * as Comlink from 'comlink';
import type { Site } from '../core/model/types';
import type { PlannerWorkerApi } from '../worker/plannerWorker';
import { plannerStore } from './plannerStoreInstance';
import { siteHolderSet } from './siteHandOver';
import { siteJsonOf } from './siteJson';

/** Starts a planner worker (module worker, same origin). */
export function plannerWorkerStart(): { api: Comlink.Remote<PlannerWorkerApi>; worker: Worker } {
  const worker = new Worker(new URL('../worker/plannerWorker.ts', import.meta.url), { type: 'module', name: 'stratplot-planner' });
  return { api: Comlink.wrap<PlannerWorkerApi>(worker), worker };
}

/**
 * Keeps `analysis` (areas, buffers, problems) in step with the site: each change is measured in a
 * worker so the page never waits on clipping; only the answer for the latest site is kept. That
 * worker is also the site's holder (siteHandOver) for design and check workers.
 */
export function siteAnalysisRunnerStart(): () => void {
  const { api, worker } = plannerWorkerStart();
  let timer: ReturnType<typeof setTimeout> | null = null;
  const run = (site: Site) => {
    const measured = api.analyse(siteJsonOf(site));
    // The worker now holds this site's text: a design or check started on it is handed the text from there.
    siteHolderSet({ site, handOver: (port) => void api.siteHandOver(Comlink.transfer(port, [port])) });
    measured
      .then((a) => {
        if (plannerStore.getState().site === site) plannerStore.setState({ analysis: { ...a, site } });
      })
      .catch((e: unknown) => {
        if (plannerStore.getState().site === site) {
          plannerStore.setState({
            analysis: { site, table: null, buffers: { type: 'FeatureCollection', features: [] }, problems: [], error: `areas could not be measured: ${(e as Error).message}` },
          });
        }
      });
  };
  run(plannerStore.getState().site);
  const unsubscribe = plannerStore.subscribe((s, prev) => {
    if (s.site === prev.site) return;
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => run(plannerStore.getState().site), 120);
  });
  return () => {
    unsubscribe();
    siteHolderSet(null);
    worker.terminate();
  };
}

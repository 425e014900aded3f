import { autosaveRestore, autosaveStart } from '../state/autosave';
import { planFileApply, planFileOf } from '../state/planFile';
import { demoDesign, demoSiteLoad } from './demoSite';
import { plannerStore } from './plannerStoreInstance';
import { resultsStore } from './results/resultsStoreInstance';
import { browserStorage as storage } from './browserStorage';
import { autosaveFlushSet } from './autosaveFlush';

/** Opens the work kept in this browser, or the invented demo site on a first visit; then keeps autosaving. */
export async function bootPlanner(): Promise<void> {
  let restored = false;
  try {
    restored = await autosaveRestore(plannerStore, storage, demoDesign(null), resultsStore);
  } catch (e) {
    plannerStore.setState({ notice: { tone: 'error', text: `${(e as Error).message}; it is kept aside untouched and the demo site was opened instead` } });
  }
  if (!restored) {
    const { site, baseline } = await demoSiteLoad();
    const design = demoDesign(baseline);
    planFileApply(plannerStore, planFileOf(site, design), design, true);
  } else {
    plannerStore.setState({ notice: { tone: 'info', text: 'Your work was restored from this browser’s copy.' } });
  }
  const { flush } = autosaveStart(
    plannerStore,
    storage,
    150,
    () => plannerStore.setState({ notice: { tone: 'error', text: 'This browser refused to keep a copy of your work: save a plan file to be safe.' } }),
    resultsStore,
  );
  autosaveFlushSet(flush);
  // An edit made just before the page is hidden or closed is written at once, not after the delay.
  document.addEventListener('visibilitychange', () => document.visibilityState === 'hidden' && void flush());
  window.addEventListener('pagehide', () => void flush());
}

import { planFileFromState } from '../state/planFile';
import { resultsSnapshotTake } from '../state/resultsSnapshot';
import { downloadFile, fileSafeName } from './downloadFile';
import { plannerStore } from './plannerStoreInstance';
import { resultsStore } from './results/resultsStoreInstance';
import { notify } from './usePlanner';

/** Writes the plan on screen (with the Results step's work) to the downloads as a plan file, and marks it saved. */
export function planSaveDownload(): void {
  const s = plannerStore.getState();
  const plan = planFileFromState(s, new Date().toISOString(), resultsSnapshotTake(resultsStore.getState()));
  downloadFile(`${fileSafeName(s.site.name, 'plan')}.stratplot.json`, JSON.stringify(plan, null, 1), 'application/json');
  plannerStore.setState({ savedRevision: s.revision });
  notify('info', 'Plan saved to your downloads.');
}

import { useId, useState } from 'react';
import type { PlanFile } from '../core/designTypes';
import { planFileApply, planFileFromState, planFileOf, planFileParse, planHasUnsavedWork } from '../state/planFile';
import { resultsSnapshotTake } from '../state/resultsSnapshot';
import { ConfirmDialog } from './ConfirmDialog';
import { demoDesign, demoSiteLoad } from './demoSite';
import { downloadFile, fileSafeName } from './downloadFile';
import { plannerStore } from './plannerStoreInstance';
import { resultsStore } from './results/resultsStoreInstance';
import { notify, usePlanner } from './usePlanner';

/** Save and open plan files; opening over unsaved work asks first (our own dialog, never a silent overwrite). */
export function FileBar() {
  const openId = useId();
  const siteName = usePlanner((s) => s.site.name);
  const unsaved = usePlanner(planHasUnsavedWork);
  const [pending, setPending] = useState<{ plan: PlanFile; what: string } | null>(null);

  const apply = (plan: PlanFile, what: string) => {
    planFileApply(plannerStore, plan, demoDesign(null), true, resultsStore);
    notify('info', `${what} opened.`);
  };
  const offer = (plan: PlanFile, what: string) => {
    if (planHasUnsavedWork(plannerStore.getState())) setPending({ plan, what });
    else apply(plan, what);
  };

  const save = () => {
    const s = plannerStore.getState();
    const plan = planFileFromState(s, new Date().toISOString(), resultsSnapshotTake(resultsStore.getState()));
    downloadFile(`${fileSafeName(s.site.name, 'plan')}.stratplot.json`, JSON.stringify(plan, null, 1), 'application/json');
    plannerStore.setState({ savedRevision: s.revision });
    notify('info', 'Plan saved to your downloads.');
  };

  const open = async (file: File | undefined) => {
    if (!file) return;
    try {
      offer(planFileParse(await file.text(), file.name), file.name);
    } catch (e) {
      notify('error', (e as Error).message);
    }
  };

  const demo = async () => {
    const { site, baseline } = await demoSiteLoad();
    offer(planFileOf(site, demoDesign(baseline)), 'The invented demo site');
  };

  return (
    <div className="file-bar">
      <span className="site-name" title={siteName}>
        {siteName}
        {unsaved ? <span className="unsaved"> · unsaved changes (kept in this browser)</span> : null}
      </span>
      <button type="button" onClick={save}>
        Save plan
      </button>
      <label htmlFor={openId} className="file-label">
        Open plan
      </label>
      <input id={openId} className="file-input" type="file" accept=".json,application/json" data-open-plan onChange={(e) => {
        void open(e.currentTarget.files?.[0]);
        e.currentTarget.value = '';
      }} />
      <button type="button" onClick={() => void demo()}>
        Demo site
      </button>
      {pending ? (
        <ConfirmDialog
          title="Replace the plan you are working on?"
          body={`${pending.what} would replace your current plan, which has changes not saved to a file. Save it first if you may need it.`}
          confirmLabel="Replace it"
          onCancel={() => setPending(null)}
          onConfirm={() => {
            apply(pending.plan, pending.what);
            setPending(null);
          }}
        />
      ) : null}
    </div>
  );
}

import { type ReactNode, useState } from 'react';
import { planHasUnsavedWork } from '../state/planFile';
import type { PlanFile } from '../state/planFileTypes';
import { planReplace } from '../state/planReplace';
import { ConfirmDialog } from './ConfirmDialog';
import { demoDesign } from './demoSite';
import { plannerStore } from './plannerStoreInstance';
import { resultsStore } from './results/resultsStoreInstance';

/**
 * Offers another plan in place of the one on screen (a plan file, a plot file, the demo site): at
 * once when nothing unsaved would be lost, else after our own question. Either way the replacement
 * is one undo step (planReplace). `saved` says whether the plan equals a file on disk.
 * Returns the offer and the question to render (null when none is pending).
 */
export function usePlanOffer(): { offer: (plan: PlanFile, what: string, saved: boolean) => void; question: ReactNode } {
  const [pending, setPending] = useState<{ plan: PlanFile; what: string; saved: boolean } | null>(null);
  const apply = (p: { plan: PlanFile; what: string; saved: boolean }) => planReplace(plannerStore, p.plan, demoDesign(null), p.what, p.saved, resultsStore);
  const offer = (plan: PlanFile, what: string, saved: boolean) => {
    if (planHasUnsavedWork(plannerStore.getState())) setPending({ plan, what, saved });
    else apply({ plan, what, saved });
  };
  const question = pending ? (
    <ConfirmDialog
      title="Replace the plan you are working on?"
      body={`${pending.what[0].toUpperCase()}${pending.what.slice(1)} would replace your current plan, which has changes not saved to a file. Undo or “Earlier work” can bring it back; save it first if you want it in a file.`}
      confirmLabel="Replace it"
      onCancel={() => setPending(null)}
      onConfirm={() => {
        apply(pending);
        setPending(null);
      }}
    />
  ) : null;
  return { offer, question };
}

import { useCallback } from 'react';
import type { DesignSettings } from '../../core/designTypes';
import { designSettingsSet } from '../../state/designActions';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, notify, usePlanner } from '../usePlanner';
import { ResultsPanel } from './ResultsPanel';

/** The results sheet wired to the planner: its plots, its site, and "Use in design" into the design settings. */
export function ResultsStep() {
  const collection = usePlanner((s) => s.result);
  const site = usePlanner((s) => s.site);
  const onUseInDesign = useCallback((patch: Partial<DesignSettings>) => {
    const ok = attempt(() => {
      designSettingsSet(plannerStore, patch);
      return true;
    });
    if (ok) notify('info', `Design settings updated: ${patch.plots ?? '?'} plots, ${patch.allocation ?? 'same'} allocation, observed SDs. Make the design again in step 3 for next season.`);
  }, []);
  return <ResultsPanel collection={collection} site={site} onUseInDesign={onUseInDesign} />;
}

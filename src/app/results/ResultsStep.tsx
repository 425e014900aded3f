import { useCallback } from 'react';
import type { DesignSettings } from '../../core/model/designTypes';
import { designSettingsSet } from '../../state/designActions';
import { plannerPlotsNamed, stratumRecordById } from '../../state/plotsNamed';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, notify, usePlanner } from '../usePlanner';
import { ResultsPanel } from './ResultsPanel';

/**
 * The results sheet wired to the planner: its plots with their strata by current name and code
 * (so checks, tables and charts say what the map says), its site, and "Use in design" into the
 * design settings (SDs re-keyed by stratum id).
 */
export function ResultsStep() {
  const collection = usePlanner(plannerPlotsNamed);
  const site = usePlanner((s) => s.site);
  const onUseInDesign = useCallback((patch: Partial<DesignSettings>) => {
    const ok = attempt(() => {
      const strata = plannerStore.getState().site.strata;
      designSettingsSet(plannerStore, patch.sd ? { ...patch, sd: stratumRecordById(patch.sd, strata) } : patch);
      return true;
    });
    if (ok) notify('info', `Design settings updated: ${patch.plots ?? '?'} plots, ${patch.allocation ?? 'same'} allocation, observed SDs. Make the design again in step 3 for next season.`);
  }, []);
  return <ResultsPanel collection={collection} site={site} onUseInDesign={onUseInDesign} />;
}

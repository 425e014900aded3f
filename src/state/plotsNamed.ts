import type { PlotCollection } from '../core/model/designTypes';
import { plotCollectionNamed } from '../core/field/plotCollectionNamed';
import type { StratumInfo } from '../core/model/types';
import type { PlannerState } from './plannerStore';

let last: { result: PlotCollection | null; strata: readonly StratumInfo[]; named: PlotCollection | null } | null = null;

/**
 * The design result as people read it, strata by their current names and codes
 * (plotCollectionNamed), for the Results step and anything else that shows stratum names. The
 * same object comes back until the result or the strata change, so it can drive React effects.
 */
export function plannerPlotsNamed(state: Pick<PlannerState, 'result' | 'site'>): PlotCollection | null {
  if (last && last.result === state.result && last.strata === state.site.strata) return last.named;
  const named = state.result ? plotCollectionNamed(state.result, state.site.strata) : null;
  last = { result: state.result, strata: state.site.strata, named };
  return named;
}

/** A record keyed by stratum names (e.g. SDs from the Results step) re-keyed by stratum id for the design settings. */
export function stratumRecordById(record: Readonly<Record<string, number>>, strata: readonly StratumInfo[]): Record<string, number> {
  const idOf = new Map(strata.map((s) => [s.label, s.key]));
  return Object.fromEntries(Object.entries(record).map(([name, v]) => [idOf.get(name) ?? name, v]));
}

import type { Polygon } from 'geojson';
import { InputError } from '../core/common/InputError';
import { polygonBesideStrata, strataWithHoleCut } from '../core/site/strataClip';
import type { PlannerStore } from './plannerStore';
import { siteCommit } from './siteCommit';
import { stratumPartAdd } from './strataActions';

/**
 * Adds a stratum feature drawn next to existing strata, clipped by them ({@link polygonBesideStrata}).
 * Returns the new part id. Throws InputError when the polygon lies wholly inside existing strata.
 */
export function stratumPartAddBeside(store: PlannerStore, stratumKey: string, polygon: Polygon): string {
  const left = polygonBesideStrata(polygon, store.getState().site.parts);
  if (!left) throw new InputError('the new stratum lies wholly inside strata already mapped: nothing left to add');
  return stratumPartAdd(store, stratumKey, left);
}

/**
 * Cuts a hole through every stratum feature the polygon overlaps ({@link strataWithHoleCut}).
 * Returns how many features changed. Throws InputError when the polygon overlaps no stratum.
 */
export function stratumHoleCut(store: PlannerStore, polygon: Polygon): number {
  let changed = 0;
  siteCommit(store, (site) => {
    const cut = strataWithHoleCut(site.parts, polygon);
    changed = cut.changed;
    if (changed === 0) throw new InputError('the hole does not overlap any stratum: draw it inside a stratum');
    return { ...site, parts: cut.parts };
  });
  return changed;
}

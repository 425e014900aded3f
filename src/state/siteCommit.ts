import type { Site } from '../core/model/types';
import type { PlannerState, PlannerStore } from './plannerStore';

/**
 * Replaces the site with an edited copy: one undo step, one autosave, and a design result (if
 * any) is marked as made from an earlier site. Every site edit goes through here.
 */
export function siteCommit(store: PlannerStore, edit: (site: Site) => Site, extra: Partial<PlannerState> = {}): void {
  const before = store.getState();
  const site = edit(before.site);
  if (site === before.site) return;
  store.setState({ ...extra, site, revision: before.revision + 1, resultStale: before.result !== null });
}

/** A fresh id for a new feature: the prefix and one more than the highest number already used. */
export function siteNextId(ids: Iterable<string>, prefix: string): string {
  let max = 0;
  const pattern = new RegExp(`^${prefix}(\\d+)$`);
  for (const id of ids) {
    const m = pattern.exec(id);
    if (m) max = Math.max(max, Number(m[1]));
  }
  return `${prefix}${max + 1}`;
}

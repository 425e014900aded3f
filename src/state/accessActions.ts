import { InputError } from '../core/common/InputError';
import type { AccessPoint } from '../core/model/types';
import type { PlannerStore } from './plannerStore';
import { siteCommit, siteNextId } from './siteCommit';

/** Adds an access point at lon/lat (degrees); returns its id. */
export function accessAdd(store: PlannerStore, lon: number, lat: number, kind: AccessPoint['kind'] = 'other', name?: string): string {
  if (!(Math.abs(lon) <= 180 && Math.abs(lat) <= 90)) throw new InputError(`access point at ${lon}, ${lat} is off the globe`);
  const id = siteNextId(
    store.getState().site.access.map((a) => a.id),
    'access-',
  );
  const point: AccessPoint = { id, name: name ?? `Access ${id.slice(7)}`, kind, lon, lat };
  siteCommit(store, (site) => ({ ...site, access: [...site.access, point] }), { selection: { kind: 'access', id } });
  return id;
}

/** Moves or renames an access point. */
export function accessUpdate(store: PlannerStore, id: string, patch: Partial<Omit<AccessPoint, 'id'>>): void {
  siteCommit(store, (site) => {
    if (!site.access.some((a) => a.id === id)) throw new InputError(`no access point "${id}"`);
    return { ...site, access: site.access.map((a) => (a.id === id ? { ...a, ...patch } : a)) };
  });
}

/** Removes an access point. */
export function accessRemove(store: PlannerStore, id: string): void {
  siteCommit(store, (site) => ({ ...site, access: site.access.filter((a) => a.id !== id) }), { selection: null });
}

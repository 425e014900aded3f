import { InputError } from '../core/common/InputError';
import { DEFAULT_BUFFER_M, type Exclusion, type ExclusionGeometry, type ExclusionKind, EXCLUSION_KINDS } from '../core/model/types';
import type { PlannerStore } from './plannerStore';
import { siteCommit, siteNextId } from './siteCommit';

/** Adds an exclusion with its kind's default safety buffer; returns its id. */
export function exclusionAdd(store: PlannerStore, kind: ExclusionKind, geometry: ExclusionGeometry, name?: string): string {
  const id = siteNextId(
    store.getState().site.exclusions.map((e) => e.id),
    'excl-',
  );
  const exclusion: Exclusion = { id, kind, geometry, bufferM: DEFAULT_BUFFER_M[kind], name: name ?? `${kind} ${id.slice(5)}` };
  siteCommit(store, (site) => ({ ...site, exclusions: [...site.exclusions, exclusion] }), { selection: { kind: 'exclusion', id } });
  return id;
}

/**
 * Changes an exclusion's kind, buffer, name or notes. Throws InputError for a negative or
 * non-finite buffer or an unknown kind.
 */
export function exclusionUpdate(store: PlannerStore, id: string, patch: Partial<Pick<Exclusion, 'kind' | 'bufferM' | 'name' | 'notes' | 'geometry'>>): void {
  if (patch.bufferM !== undefined && !(Number.isFinite(patch.bufferM) && patch.bufferM >= 0)) {
    throw new InputError(`exclusion ${id}: buffer must be a number of metres, 0 or more`);
  }
  if (patch.kind !== undefined && !EXCLUSION_KINDS.includes(patch.kind)) {
    throw new InputError(`exclusion ${id}: kind must be one of ${EXCLUSION_KINDS.join(', ')}`);
  }
  siteCommit(store, (site) => {
    if (!site.exclusions.some((e) => e.id === id)) throw new InputError(`no exclusion "${id}"`);
    return { ...site, exclusions: site.exclusions.map((e) => (e.id === id ? { ...e, ...patch } : e)) };
  });
}

/** Removes an exclusion. */
export function exclusionRemove(store: PlannerStore, id: string): void {
  siteCommit(store, (site) => ({ ...site, exclusions: site.exclusions.filter((e) => e.id !== id) }), { selection: null });
}

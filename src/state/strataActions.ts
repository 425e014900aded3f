import { InputError } from '../core/common/InputError';
import type { AreaGeometry, Site, StratumInfo } from '../core/model/types';
import type { PlannerStore } from './plannerStore';
import { siteCommit, siteNextId } from './siteCommit';
import { STRATUM_PALETTE } from '../io/site/strataFromFeatures';
import { stratumCodeDerive } from '../io/site/stratumCodeDerive';

const COLOUR = /^#[0-9a-fA-F]{6}$/;

function paletteNext(used: readonly string[]): string {
  const taken = new Set(used.map((c) => c.toLowerCase()));
  return STRATUM_PALETTE.find((c) => !taken.has(c)) ?? STRATUM_PALETTE[used.length % STRATUM_PALETTE.length];
}

function stratumInfoNew(site: Site, name: string): StratumInfo {
  const key = name.trim();
  if (!key) throw new InputError('a stratum needs a name');
  if (site.strata.some((s) => s.key === key)) throw new InputError(`a stratum called "${key}" already exists`);
  return {
    key,
    label: key,
    code: stratumCodeDerive(key, new Set(site.strata.map((s) => s.code))),
    colour: paletteNext(site.strata.map((s) => s.colour)),
  };
}

function stratumPatch(store: PlannerStore, key: string, patch: Partial<StratumInfo>): void {
  siteCommit(store, (site) => {
    if (!site.strata.some((s) => s.key === key)) throw new InputError(`no stratum "${key}"`);
    return { ...site, strata: site.strata.map((s) => (s.key === key ? { ...s, ...patch } : s)) };
  });
}

/**
 * Changes the name a stratum is shown with everywhere (map, tables, every file written, the plan
 * file); its stable id (the key its features and plots refer to) stays. Throws InputError for a
 * blank name or one another stratum goes by (as its name or id), since files name strata by it.
 */
export function stratumRename(store: PlannerStore, key: string, label: string): void {
  const clean = label.trim();
  if (!clean) throw new InputError(`stratum "${key}": the name cannot be blank`);
  const other = store.getState().site.strata.find((s) => s.key !== key && (s.label === clean || s.key === clean));
  if (other) throw new InputError(`another stratum is already called "${clean}"; choose a name of its own`);
  stratumPatch(store, key, { label: clean });
}

/** Sets a stratum's display colour (#rrggbb). Throws InputError for anything else. */
export function stratumRecolour(store: PlannerStore, key: string, colour: string): void {
  if (!COLOUR.test(colour)) throw new InputError(`stratum "${key}": colour "${colour}" is not #rrggbb`);
  stratumPatch(store, key, { colour: colour.toLowerCase() });
}

/** Sets a stratum's short code used in plot ids: 1–6 letters or digits, unique. */
export function stratumRecode(store: PlannerStore, key: string, code: string): void {
  const clean = code.trim().toUpperCase();
  if (!/^[A-Z0-9]{1,6}$/.test(clean)) throw new InputError(`stratum "${key}": code "${code}" must be 1–6 letters or digits`);
  const other = store.getState().site.strata.find((s) => s.code === clean && s.key !== key);
  if (other) throw new InputError(`code ${clean} is already used by stratum "${other.label}"`);
  stratumPatch(store, key, { code: clean });
}

/** Moves every feature of stratum `fromKey` into `intoKey` and drops `fromKey`. */
export function strataMerge(store: PlannerStore, fromKey: string, intoKey: string): void {
  if (fromKey === intoKey) throw new InputError('choose two different strata to merge');
  siteCommit(store, (site) => {
    for (const k of [fromKey, intoKey]) if (!site.strata.some((s) => s.key === k)) throw new InputError(`no stratum "${k}"`);
    return {
      ...site,
      strata: site.strata.filter((s) => s.key !== fromKey),
      parts: site.parts.map((p) => (p.stratum === fromKey ? { ...p, stratum: intoKey } : p)),
    };
  });
}

/** Adds a mapped feature to a stratum (creating the stratum if it is new); returns the part id. */
export function stratumPartAdd(store: PlannerStore, stratumKey: string, geometry: AreaGeometry): string {
  const site = store.getState().site;
  const id = siteNextId(
    site.parts.map((p) => p.id),
    'part-',
  );
  const known = site.strata.some((s) => s.key === stratumKey);
  const info = known ? null : stratumInfoNew(site, stratumKey);
  // One commit, so the new stratum and its first feature are one undo step.
  siteCommit(
    store,
    (s) => ({ ...s, strata: info ? [...s.strata, info] : s.strata, parts: [...s.parts, { id, stratum: info?.key ?? stratumKey, geometry }] }),
    { selection: { kind: 'part', id } },
  );
  return id;
}

/** Replaces the geometry of one stratum feature (after vertex editing). */
export function stratumPartReshape(store: PlannerStore, partId: string, geometry: AreaGeometry): void {
  siteCommit(store, (site) => {
    if (!site.parts.some((p) => p.id === partId)) throw new InputError(`no stratum feature "${partId}"`);
    return { ...site, parts: site.parts.map((p) => (p.id === partId ? { ...p, geometry } : p)) };
  });
}

/** Removes one stratum feature; the stratum itself stays listed until merged or emptied by the user. */
export function stratumPartRemove(store: PlannerStore, partId: string): void {
  siteCommit(
    store,
    (site) => ({ ...site, parts: site.parts.filter((p) => p.id !== partId) }),
    { selection: null },
  );
}


import type { AllocationRow, PlotCollection, PlotProperties } from '../model/designTypes';
import { stratumNamesQuoted } from './stratumNamesInText';
import type { StratumInfo } from '../model/types';

/** A stratum id and its current name and code. */
interface StratumNaming {
  id: string;
  name: string;
  code: string;
}

/** Finds a plot's stratum by id, then by name, then by the code the plot carries. */
function stratumFinder(strata: readonly StratumInfo[]): (stratum: string, code?: string) => StratumNaming | null {
  const byKey = new Map(strata.map((s) => [s.key, s]));
  const byLabel = new Map(strata.map((s) => [s.label, s]));
  const byCode = new Map(strata.map((s) => [s.code, s]));
  return (stratum, code) => {
    const s = byKey.get(stratum) ?? byLabel.get(stratum) ?? (code ? byCode.get(code) : undefined);
    return s ? { id: s.key, name: s.label, code: s.code } : null;
  };
}

const renameQuoted = stratumNamesQuoted;

function renameKeys(record: Record<string, number>, names: ReadonlyMap<string, string>): Record<string, number> {
  return Object.fromEntries(Object.entries(record ?? {}).map(([k, v]) => [names.get(k) ?? k, v]));
}

/**
 * The collection as files and people read it: every plot's `stratum` is its stratum's current
 * name with `stratum_code` its current code, and the design summary follows (allocation rows,
 * pilot SDs and costs by name, stratum names quoted in warnings and statements). Plots are
 * matched to `strata` by stable id (`StratumInfo.key`), else by name, else by the code they carry,
 * so a plot file that already names its strata comes through unchanged; plots of no listed
 * stratum keep what they had. With `ids`, plots and allocation rows also keep the stable id as
 * `stratum_id` (the plan file's form, read back by {@link plotCollectionById}). Pure.
 */
export function plotCollectionNamed(collection: PlotCollection, strata: readonly StratumInfo[], options: { ids?: boolean } = {}): PlotCollection {
  const find = stratumFinder(strata);
  const names = new Map<string, string>();
  const named = (p: PlotProperties): PlotProperties => {
    const s = find(p.stratum, p.stratum_code);
    if (!s) return p;
    if (s.id !== s.name) names.set(s.id, s.name);
    // The properties in their order, with the code (and id) right after the name, where people
    // look for it. A plain loop: on 10,000 plots, building entry arrays took tens of milliseconds
    // of the page's thread, and the collection after them as much again.
    const from = p as unknown as Record<string, unknown>;
    const out: Record<string, unknown> = {};
    for (const k of Object.keys(from)) {
      if (k === 'stratum_code' || k === 'stratum_id') continue;
      if (k !== 'stratum') {
        out[k] = from[k];
        continue;
      }
      out.stratum = s.name;
      out.stratum_code = s.code;
      if (options.ids) out.stratum_id = s.id;
    }
    // A plot found by its code alone gets its name (and the code after it) at the end.
    if (!('stratum' in out)) {
      out.stratum = s.name;
      out.stratum_code = s.code;
      if (options.ids) out.stratum_id = s.id;
    }
    return out as unknown as PlotProperties;
  };
  const features = collection.features.map((f) => ({ ...f, properties: named(f.properties) }));
  const d = collection.design;
  if (!d) return { ...collection, features };
  const allocation = (d.allocation ?? []).map((r): AllocationRow => {
    const s = find(r.stratum);
    if (!s) return r;
    if (s.id !== s.name) names.set(s.id, s.name);
    return options.ids ? ({ ...r, stratum: s.name, stratum_id: s.id } as AllocationRow) : { ...r, stratum: s.name };
  });
  const settings = d.settings ? { ...d.settings, sd: renameKeys(d.settings.sd, names), cost: renameKeys(d.settings.cost, names) } : d.settings;
  const design = {
    ...d,
    settings,
    allocation,
    warnings: (d.warnings ?? []).map((w) => renameQuoted(w, names)),
    statements: (d.statements ?? []).map((w) => renameQuoted(w, names)),
  };
  return { ...collection, features, design };
}

/**
 * The inverse of {@link plotCollectionNamed} with `ids`: plots and allocation rows take their
 * stratum from `stratum_id` again (the planner's form), lose the name and code copies, and the
 * design summary's names go back to ids. Collections without ids come back unchanged.
 */
export function plotCollectionById(collection: PlotCollection): PlotCollection {
  const names = new Map<string, string>();
  const features = collection.features.map((f) => {
    const { stratum_code: _code, stratum_id: id, ...rest } = f.properties;
    if (typeof id !== 'string') return f;
    if (rest.stratum !== id) names.set(rest.stratum, id);
    return { ...f, properties: { ...rest, stratum: id } };
  });
  const d = collection.design;
  if (!d) return { ...collection, features };
  const allocation = (d.allocation ?? []).map((r) => {
    const { stratum_id: id, ...rest } = r as AllocationRow & { stratum_id?: string };
    if (typeof id !== 'string') return r;
    if (rest.stratum !== id) names.set(rest.stratum, id);
    return { ...rest, stratum: id };
  });
  if (names.size === 0 && allocation.every((r, i) => r === d.allocation[i]) && features.every((f, i) => f === collection.features[i])) return collection;
  const settings = d.settings ? { ...d.settings, sd: renameKeys(d.settings.sd, names), cost: renameKeys(d.settings.cost, names) } : d.settings;
  return {
    ...collection,
    features,
    design: { ...d, settings, allocation, warnings: (d.warnings ?? []).map((w) => renameQuoted(w, names)), statements: (d.statements ?? []).map((w) => renameQuoted(w, names)) },
  };
}

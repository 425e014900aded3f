import { countNoun } from '../core/common/countNoun';
import type { DesignSettings, PlotCollection, PlotProperties } from '../core/model/designTypes';
import { footprintFormat } from '../core/design/footprintParse';
import type { Site } from '../core/model/types';
import type { PlannerPlan, PlannerStep } from './plannerStore';

/** One change of the plan in words (past tense, as it was made) and the step it belongs to. */
export interface PlanChange {
  text: string;
  /** The step whose sheet shows what changed; null when the change is not on one step (another plan opened). */
  step: PlannerStep | null;
}

const SETTING_NAMES: Record<string, string> = {
  plots: 'total primary plots',
  allocation: 'allocation',
  shareBasis: 'shares from',
  minPerStratum: 'minimum per stratum',
  sd: 'pilot SDs',
  cost: 'relative costs',
  targetHalfwidth: 'target precision',
  pilotMean: 'pilot mean',
  spacingM: 'minimum spacing',
  footprint: 'plot footprint',
  edgeBufferM: 'edge buffer',
  reservePerStratum: 'reserves per stratum',
  method: 'placement method',
  gridSpacingM: 'grid spacing',
  gridAngleDeg: 'grid rotation',
  baseline: 'transect baseline',
  transectIntervalM: 'transect interval',
  quadratIntervalM: 'quadrat interval',
  seed: 'seed',
  redistributeShortfall: 'moving plots a full stratum cannot hold',
};

const quote = (name: string) => `“${name}”`;

function settingValue(key: string, v: unknown): string | null {
  if (v === null || v === undefined) return 'none';
  if (key === 'footprint') return footprintFormat(v as DesignSettings['footprint']);
  if (typeof v === 'boolean') return v ? 'on' : 'off';
  if (typeof v === 'number' || typeof v === 'string') return String(v);
  return null;
}

function designPhrases(older: DesignSettings, newer: DesignSettings): string[] {
  const out: string[] = [];
  const keys = new Set([...Object.keys(older), ...Object.keys(newer)]);
  for (const key of keys) {
    const a = (older as unknown as Record<string, unknown>)[key];
    const b = (newer as unknown as Record<string, unknown>)[key];
    if (a === b || JSON.stringify(a) === JSON.stringify(b)) continue;
    const name = SETTING_NAMES[key] ?? key;
    const from = settingValue(key, a);
    const to = settingValue(key, b);
    out.push(from !== null && to !== null ? `${name} ${from} → ${to}` : `${name} changed`);
  }
  return out;
}

function byId<T>(list: readonly T[], id: (t: T) => string): Map<string, T> {
  return new Map(list.map((t) => [id(t), t]));
}

/** Added, removed and changed members of two lists keyed by id (changed: a different object under the same id). */
function listDiff<T>(older: readonly T[], newer: readonly T[], id: (t: T) => string) {
  const a = byId(older, id);
  const b = byId(newer, id);
  return {
    added: newer.filter((t) => !a.has(id(t))),
    removed: older.filter((t) => !b.has(id(t))),
    changed: newer.filter((t) => a.has(id(t)) && a.get(id(t)) !== t).map((t) => [a.get(id(t)) as T, t] as const),
  };
}

/** "added stratum “A”", or a count when there are several. */
function listPhrase<T>(verb: string, items: readonly T[], singular: string, plural: string, name: (t: T) => string): string[] {
  if (items.length === 0) return [];
  if (items.length <= 2) return items.map((t) => `${verb} ${singular} ${quote(name(t))}`);
  return [`${verb} ${countNoun(items.length, singular, plural)}`];
}

function strataPhrases(older: Site, newer: Site): string[] {
  const out: string[] = [];
  if (older.name !== newer.name) out.push(`site renamed to ${quote(newer.name)}`);
  const label = new Map([...older.strata, ...newer.strata].map((s) => [s.key, s.label]));
  const strata = listDiff(older.strata, newer.strata, (s) => s.key);
  const newStratumOf = new Map(newer.parts.map((p) => [p.id, p.stratum]));
  const merged = strata.removed.filter((s) => older.parts.some((p) => p.stratum === s.key && newStratumOf.has(p.id) && newStratumOf.get(p.id) !== s.key));
  for (const s of merged) {
    const into = older.parts.map((p) => (p.stratum === s.key ? newStratumOf.get(p.id) : undefined)).find((k) => k && k !== s.key);
    out.push(`merged ${quote(s.label)} into ${quote(label.get(into ?? '') ?? into ?? '?')}`);
  }
  out.push(...listPhrase('added', strata.added, 'stratum', 'strata', (s) => s.label));
  out.push(...listPhrase('removed', strata.removed.filter((s) => !merged.includes(s)), 'stratum', 'strata', (s) => s.label));
  for (const [a, b] of strata.changed) {
    if (a.label !== b.label) out.push(`renamed stratum ${quote(a.label)} to ${quote(b.label)}`);
    if (a.code !== b.code) out.push(`code of ${quote(b.label)} ${a.code} → ${b.code}`);
    if (a.colour !== b.colour) out.push(`recoloured ${quote(b.label)}`);
  }
  // Features of strata added, removed or merged above are told by those phrases already.
  const told = new Set([...strata.added, ...strata.removed].map((s) => s.key));
  const parts = listDiff(older.parts, newer.parts, (p) => p.id);
  const perStratum = (list: readonly { stratum: string }[], verb: string, prep: string) => {
    const counts = new Map<string, number>();
    for (const p of list) if (!told.has(p.stratum)) counts.set(p.stratum, (counts.get(p.stratum) ?? 0) + 1);
    for (const [k, n] of counts) out.push(`${verb} ${n === 1 ? 'a feature' : countNoun(n, 'feature')} ${prep} ${quote(label.get(k) ?? k)}`);
  };
  perStratum(parts.added, 'added', 'to');
  perStratum(parts.removed, 'removed', 'of');
  const reshaped = parts.changed.filter(([a, b]) => a.geometry !== b.geometry && !told.has(b.stratum));
  if (reshaped.length === 1) out.push(`reshaped a feature of ${quote(label.get(reshaped[0][1].stratum) ?? reshaped[0][1].stratum)}`);
  else if (reshaped.length > 1) out.push(`reshaped ${countNoun(reshaped.length, 'stratum feature')}`);
  if (older.boundary !== newer.boundary) out.push('changed the site boundary');
  return out;
}

function groundPhrases(older: Site, newer: Site): string[] {
  const out: string[] = [];
  const excl = listDiff(older.exclusions, newer.exclusions, (e) => e.id);
  const exclName = (e: Site['exclusions'][number]) => e.name || `${e.kind} ${e.id}`;
  out.push(...listPhrase('added', excl.added, 'exclusion', 'exclusions', exclName));
  out.push(...listPhrase('removed', excl.removed, 'exclusion', 'exclusions', exclName));
  for (const [a, b] of excl.changed) {
    if ((a.name ?? '') !== (b.name ?? '')) out.push(`renamed exclusion ${quote(exclName(a))} to ${quote(exclName(b))}`);
    if (a.kind !== b.kind) out.push(`${quote(exclName(b))} marked as ${b.kind}`);
    if (a.bufferM !== b.bufferM) out.push(`buffer of ${quote(exclName(b))} ${a.bufferM} → ${b.bufferM} m`);
    if ((a.notes ?? '') !== (b.notes ?? '')) out.push(`notes of ${quote(exclName(b))} changed`);
    if (a.geometry !== b.geometry) out.push(`reshaped ${quote(exclName(b))}`);
  }
  const access = listDiff(older.access, newer.access, (a) => a.id);
  out.push(...listPhrase('added', access.added, 'access point', 'access points', (a) => a.name));
  out.push(...listPhrase('removed', access.removed, 'access point', 'access points', (a) => a.name));
  for (const [a, b] of access.changed) out.push(a.name !== b.name ? `renamed access point ${quote(a.name)} to ${quote(b.name)}` : `changed access point ${quote(b.name)}`);
  return out;
}

/** True when both collections hold the same plots at the same places (so only field states can differ). */
function samePlots(a: PlotCollection, b: PlotCollection): boolean {
  if (a.features.length !== b.features.length) return false;
  return a.features.every((f, i) => {
    const g = b.features[i];
    return f.properties.plot_id === g.properties.plot_id && f.geometry.coordinates[0] === g.geometry.coordinates[0] && f.geometry.coordinates[1] === g.geometry.coordinates[1];
  });
}

function statusPhrase(a: PlotProperties, b: PlotProperties): string | null {
  const was = a.status ?? 'planned';
  const now = b.status ?? 'planned';
  if (was === now) return null;
  if (now === 'rejected') return `${b.plot_id} rejected${b.reject_reason ? ` (${b.reject_reason})` : ''}`;
  if (now === 'promoted') return `${b.plot_id} promoted${b.replaces ? ` to replace ${b.replaces}` : ''}`;
  if (was === 'rejected') return `${b.plot_id} restored`;
  if (was === 'promoted') return `${b.plot_id} back in reserve`;
  return `${b.plot_id} ${was} → ${now}`;
}

function visitPhrase(a: PlotProperties, b: PlotProperties): string | null {
  if (!a.visited_at && b.visited_at) return `${b.plot_id} visited`;
  if (a.visited_at && !b.visited_at) return `visit to ${b.plot_id} taken back`;
  if (JSON.stringify([a.field_values, a.crew_note]) !== JSON.stringify([b.field_values, b.crew_note])) return `entries for ${b.plot_id}`;
  return null;
}

function resultPhrases(older: PlannerPlan, newer: PlannerPlan): { design: string[]; field: string[] } {
  const a = older.result;
  const b = newer.result;
  const design: string[] = [];
  const field: string[] = [];
  if (a !== b) {
    if (!b) design.push('cleared the design');
    else if (!a || !samePlots(a, b)) {
      const primaries = b.features.filter((f) => f.properties.role === 'primary').length;
      design.push(`made a design of ${countNoun(primaries, 'primary plot')} and ${countNoun(b.features.length - primaries, 'reserve')}`);
    } else {
      b.features.forEach((f, i) => {
        const phrase = statusPhrase(a.features[i].properties, f.properties) ?? visitPhrase(a.features[i].properties, f.properties);
        if (phrase) field.push(phrase);
      });
      if (field.length === 0) field.push('changed the field notes of the plots');
    }
  }
  return { design, field };
}

function joined(phrases: string[]): string {
  if (phrases.length <= 3) return phrases.join('; ');
  return `${phrases.slice(0, 3).join('; ')} and ${countNoun(phrases.length - 3, 'more change')}`;
}

/**
 * Says in words what changed between two states of the plan (older → newer) and which step it is
 * on: another plan opened, a design made or cleared, field decisions (rejections, promotions,
 * restores, whatever changed the plots' status), site edits, design settings. Works on the plan's
 * data alone, so any action that changes the plan is described without naming it here.
 */
export function planChangeDescribe(older: PlannerPlan, newer: PlannerPlan): PlanChange {
  if (older.planOpened !== newer.planOpened && older.planOpened.serial !== newer.planOpened.serial) {
    return { text: `opened ${newer.planOpened.what}`, step: null };
  }
  const { design: made, field } = resultPhrases(older, newer);
  const strata = older.site === newer.site ? [] : strataPhrases(older.site, newer.site);
  const ground = older.site === newer.site ? [] : groundPhrases(older.site, newer.site);
  const settings = older.design === newer.design ? [] : designPhrases(older.design, newer.design);
  if (older.field !== newer.field) settings.push('changed the field setup (crew, measurements, arrival radius)');
  const groups: [string[], PlannerStep][] = [
    [field, 'plots'],
    [made, 'design'],
    [strata, 'strata'],
    [ground, 'exclusions'],
    [settings, 'design'],
  ];
  const first = groups.find(([p]) => p.length > 0);
  if (!first) return { text: 'changed the plan', step: null };
  return { text: joined(groups.flatMap(([p]) => p)), step: first[1] };
}

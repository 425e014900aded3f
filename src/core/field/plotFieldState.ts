import type { FieldRejection, PlotCollection, PlotProperties } from '../model/designTypes';

/** The four field states a plot is drawn and listed by (one symbol each, see plotSymbols). */
export const PLOT_FIELD_STATE_KEYS = ['primary', 'reserve', 'promoted', 'rejected'] as const;
export type PlotFieldStateKey = (typeof PLOT_FIELD_STATE_KEYS)[number];

/**
 * What a crew is to do with a plot, read from its stored field state: sample a primary, keep a
 * reserve waiting, sample a promoted reserve in place of the plot it replaces, or stay away from a
 * rejected plot. Active plots (primary, promoted) are the ones to visit.
 */
export type PlotFieldState =
  | { key: 'primary'; active: true }
  | { key: 'reserve'; active: false }
  | { key: 'promoted'; active: true; replaces: string }
  | {
      key: 'rejected';
      active: false;
      reason: string;
      /** ISO 8601, or null when the file did not record it. */
      atIso: string | null;
      /** The reserve promoted in its place, or null when its stratum had none left. */
      replacedBy: string | null;
      /** The plot that stands in for it now: `replacedBy`, or that plot's own replacement when it was rejected too. */
      standIn: string | null;
      /** For a rejected promoted reserve: the plot it had replaced. */
      replaces: string | null;
    };

/**
 * Field states of every plot, by plot id: the one reading of `status`, `reject_reason`,
 * `rejected_at` and `replaces` that the planner, every file writer and the results check share.
 * A plot's replacement is the plot whose `replaces` names it (promoted, or promoted and since
 * rejected itself). Plots without a status are as designed. Common practice, no source.
 */
export function plotFieldStates(plots: readonly PlotProperties[]): Map<string, PlotFieldState> {
  const replacedBy = new Map<string, string>();
  for (const p of plots) if (p.replaces && (p.status === 'promoted' || p.status === 'rejected')) replacedBy.set(p.replaces, p.plot_id);
  const rejected = new Set(plots.filter((p) => p.status === 'rejected').map((p) => p.plot_id));
  const standIn = (id: string): string | null => {
    let at = replacedBy.get(id) ?? null;
    for (let hops = 0; at !== null && rejected.has(at) && hops <= plots.length; hops++) at = replacedBy.get(at) ?? null;
    return at !== null && rejected.has(at) ? null : at;
  };
  const out = new Map<string, PlotFieldState>();
  for (const p of plots) out.set(p.plot_id, plotFieldStateOf(p, replacedBy.get(p.plot_id) ?? null, standIn(p.plot_id)));
  return out;
}

/** The field state of one plot, given the plot that replaced it and the one standing in for it now (if any). */
export function plotFieldStateOf(p: PlotProperties, replacedBy: string | null, standIn: string | null = replacedBy): PlotFieldState {
  if (p.status === 'rejected') {
    return {
      key: 'rejected',
      active: false,
      reason: p.reject_reason?.trim() || 'no reason recorded',
      atIso: p.rejected_at ?? null,
      replacedBy,
      standIn,
      replaces: p.replaces ?? null,
    };
  }
  if (p.status === 'promoted' && p.replaces) return { key: 'promoted', active: true, replaces: p.replaces };
  return p.role === 'reserve' ? { key: 'reserve', active: false } : { key: 'primary', active: true };
}

/** "2026-12-01 09:30 UTC" from an ISO time, or "" when there is none. */
export function fieldTimeText(atIso: string | null): string {
  if (!atIso) return '';
  const d = new Date(atIso);
  return Number.isNaN(d.getTime()) ? atIso : `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
}

/**
 * The field state in words: `short` for tables, labels and GPS type fields ("primary",
 * "reserve", "promoted, replaces BAN-01", "REJECTED"), `note` a sentence telling the crew what to
 * do, with the reason and time of a rejection and what replaced it.
 */
export function plotFieldStateText(p: Pick<PlotProperties, 'rank'>, s: PlotFieldState): { short: string; note: string } {
  switch (s.key) {
    case 'primary':
      return { short: 'primary', note: `Primary plot, rank ${p.rank}: sample it.` };
    case 'reserve':
      return { short: 'reserve', note: `Reserve, rank ${p.rank}, waiting: use it only to replace a rejected plot of its stratum, in rank order.` };
    case 'promoted':
      return { short: `promoted, replaces ${s.replaces}`, note: `Promoted reserve, rank ${p.rank}: replaces rejected plot ${s.replaces}. Sample it.` };
    case 'rejected': {
      const when = fieldTimeText(s.atIso);
      const short = 'no reserve was left, so its stratum is one plot short';
      const then = !s.replacedBy
        ? short
        : s.standIn === s.replacedBy
          ? `replaced by ${s.replacedBy}`
          : `replaced by ${s.replacedBy}, since rejected too; ${s.standIn ? `${s.standIn} stands in now` : short}`;
      return { short: 'REJECTED', note: `REJECTED${when ? ` ${when}` : ''}: ${s.reason}. Do not visit; ${then}.` };
    }
  }
}

/** True for the plots a crew is to visit: primaries not rejected and promoted reserves. */
export function plotIsActive(p: PlotProperties): boolean {
  return p.status === 'rejected' ? false : p.status === 'promoted' ? Boolean(p.replaces) : p.role === 'primary';
}

/**
 * The field decisions recorded on a collection's plots, as a list: every rejected plot with its
 * reason, time and replacement, earliest first (plots without a time last, by id).
 */
export function plotRejections(collection: Pick<PlotCollection, 'features'>): FieldRejection[] {
  const plots = collection.features.map((f) => f.properties);
  const states = plotFieldStates(plots);
  const out: FieldRejection[] = [];
  for (const p of plots) {
    const s = states.get(p.plot_id);
    if (s?.key === 'rejected') out.push({ plot_id: p.plot_id, reason: s.reason, replacement: s.replacedBy, at: s.atIso });
  }
  return out.sort((a, b) => (a.at ?? '\uffff').localeCompare(b.at ?? '\uffff') || a.plot_id.localeCompare(b.plot_id, 'en', { numeric: true }));
}

/**
 * One line per field decision for briefings and file descriptions, e.g. "BAN-01 rejected
 * 2026-12-01 09:30 UTC: Unsafe to reach; replaced by BAN-R1." (empty when nothing was rejected).
 */
export function plotRejectionLines(collection: Pick<PlotCollection, 'features'>): string[] {
  return plotRejections(collection).map((r) => {
    const when = fieldTimeText(r.at);
    return `${r.plot_id} rejected${when ? ` ${when}` : ''}: ${r.reason}; ${r.replacement ? `replaced by ${r.replacement}` : 'no reserve left, its stratum is one plot short'}.`;
  });
}

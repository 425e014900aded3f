import type { PlotCollection, PlotProperties } from '../model/designTypes';
import { InputError } from '../common/InputError';

/** A restored plot and the plot file after it. */
export interface RestoreOutcome {
  collection: PlotCollection;
  /** The reserve that went back to waiting, or null when the rejection had promoted none. */
  demoted: string | null;
  /** One line for the crew: what was restored and what stands down. */
  message: string;
}

function withoutRejection(p: PlotProperties): PlotProperties {
  const { reject_reason: _reason, rejected_at: _at, ...rest } = p;
  return { ...rest, status: p.replaces ? 'promoted' : 'planned' };
}

function asWaiting(p: PlotProperties): PlotProperties {
  const { replaces: _replaces, ...rest } = p;
  return { ...rest, status: 'planned' };
}

/**
 * Undoes the rejection of plot `plotId` (see plotsRejectAndPromote): the plot is active again —
 * a primary, or the promoted reserve it was — and the reserve promoted in its place goes back to
 * waiting, so the plot file is as it was before the rejection. Pure: returns a new collection.
 * Throws InputError when the id is unknown, the plot is not rejected, or its replacement has been
 * rejected since (restore that one first, so no decision is lost).
 */
export function plotsRestore(collection: PlotCollection, plotId: string): RestoreOutcome {
  const index = collection.features.findIndex((f) => f.properties.plot_id === plotId);
  if (index < 0) throw new InputError(`no plot "${plotId}" in this plot file`);
  const target = collection.features[index].properties;
  if (target.status !== 'rejected') throw new InputError(`plot ${plotId} is not rejected, so there is nothing to restore`);
  const stand = collection.features.findIndex((f) => f.properties.replaces === plotId && (f.properties.status === 'promoted' || f.properties.status === 'rejected'));
  const standIn = stand >= 0 ? collection.features[stand].properties : null;
  if (standIn?.status === 'rejected') {
    throw new InputError(`plot ${plotId} was replaced by ${standIn.plot_id}, which has been rejected since; restore ${standIn.plot_id} first`);
  }
  const features = collection.features.map((f, i) => {
    if (i === index) return { ...f, properties: withoutRejection(f.properties) };
    if (i === stand) return { ...f, properties: asWaiting(f.properties) };
    return f;
  });
  const demoted = standIn?.plot_id ?? null;
  const message = demoted
    ? `${plotId} restored: visit it again; reserve ${demoted} goes back to waiting.`
    : `${plotId} restored: visit it again.`;
  return { collection: { ...collection, features }, demoted, message };
}

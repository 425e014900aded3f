import type { FieldRejection, PlotCollection } from '../model/designTypes';
import { InputError } from '../common/InputError';

/** A field decision and the plot file after it. */
export interface RejectionOutcome {
  collection: PlotCollection;
  rejection: FieldRejection;
  /** One line for the crew: what was rejected and what replaces it (or that nothing can). */
  message: string;
}

/**
 * Records that a crew could not sample primary plot `plotId` and promotes, in its place, the unused
 * reserve of the same stratum with the lowest rank — strictly in rank order, so the choice is never
 * the crew's. The rejected plot gets status 'rejected', the reason and the time (`rejected_at`);
 * the reserve gets status 'promoted' and `replaces`. A promoted reserve that is later rejected is
 * replaced the same way (and keeps `replaces`, so a restore can give it back its place).
 * {@link plotsRestore} undoes it exactly.
 * With no reserve left, `rejection.replacement` is null and the message says the stratum is short.
 * Pure: returns a new collection and leaves the given one as it was.
 * Source of the rule: replacement of non-response units by pre-ordered reserves taken in sequence
 * (common practice in probability field surveys, no single source).
 * @param atIso when the decision was made, ISO 8601
 * Throws InputError when the id is unknown, names a reserve that was never promoted, or a plot
 * already rejected, or the reason is empty, or the time is not a date.
 */
export function plotsRejectAndPromote(collection: PlotCollection, plotId: string, reason: string, atIso: string): RejectionOutcome {
  const why = reason.trim();
  if (!why) throw new InputError(`give a reason for rejecting plot ${plotId}`);
  if (Number.isNaN(new Date(atIso).getTime())) throw new InputError(`the time of the rejection of plot ${plotId} is not a date: "${atIso}"`);
  const index = collection.features.findIndex((f) => f.properties.plot_id === plotId);
  if (index < 0) throw new InputError(`no plot "${plotId}" in this plot file`);
  const target = collection.features[index].properties;
  if (target.status === 'rejected') throw new InputError(`plot ${plotId} is already rejected (${target.reject_reason ?? 'no reason given'})`);
  if (target.role === 'reserve' && target.status !== 'promoted') {
    throw new InputError(`plot ${plotId} is an unused reserve; only primaries and promoted reserves can be rejected`);
  }
  let best = -1;
  collection.features.forEach((f, i) => {
    const p = f.properties;
    if (p.stratum !== target.stratum || p.role !== 'reserve' || (p.status ?? 'planned') !== 'planned') return;
    if (best < 0 || p.rank < collection.features[best].properties.rank) best = i;
  });
  const features = collection.features.map((f, i) => {
    if (i === index) return { ...f, properties: { ...f.properties, status: 'rejected' as const, reject_reason: why, rejected_at: atIso } };
    if (i === best) return { ...f, properties: { ...f.properties, status: 'promoted' as const, replaces: plotId } };
    return f;
  });
  const replacement = best >= 0 ? collection.features[best].properties.plot_id : null;
  const message = replacement
    ? `${plotId} rejected (${why}); reserve ${replacement} replaces it.`
    : `${plotId} rejected (${why}); stratum "${target.stratum}" has no reserve left, so it is one plot short — note it in the report.`;
  return {
    collection: { ...collection, features },
    rejection: { plot_id: plotId, reason: why, replacement, at: atIso },
    message,
  };
}

import { InputError } from '../core/common/InputError';
import { plotsRejectAndPromote } from '../core/field/plotsRejectAndPromote';
import type { PlannerStore } from './plannerStore';

/**
 * Marks a plot rejected with the crew's reason and the time, and promotes the next reserve of its
 * stratum in rank order (plotsRejectAndPromote); the decision is kept on the plots of the design,
 * the one record every screen and file reads. Returns the promoted plot id, or null when the
 * stratum had no reserve left. Throws InputError with no design, a blank reason, or an unknown plot.
 */
export function plotReject(store: PlannerStore, plotId: string, reason: string, atIso = new Date().toISOString()): string | null {
  const s = store.getState();
  if (!s.result) throw new InputError('there is no design yet: run one before rejecting plots');
  if (!reason.trim()) throw new InputError(`plot ${plotId}: give a reason for rejecting it`);
  const { collection, rejection, message } = plotsRejectAndPromote(s.result, plotId, reason.trim(), atIso);
  store.setState({ result: collection, revision: s.revision + 1, notice: { tone: 'info', text: message } });
  return rejection.replacement;
}

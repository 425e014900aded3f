import { InputError } from '../core/common/InputError';
import { plotsRestore } from '../core/field/plotsRestore';
import type { PlannerStore } from './plannerStore';

/**
 * Undoes the rejection of a plot (plotsRestore): the plot is to be visited again and the reserve
 * promoted in its place goes back to waiting. Returns that reserve's id, or null when none had
 * been promoted. Throws InputError with no design, an unknown or unrejected plot, or when its
 * replacement has been rejected since (restore that one first).
 */
export function plotRestore(store: PlannerStore, plotId: string): string | null {
  const s = store.getState();
  if (!s.result) throw new InputError('there is no design yet, so no plot to restore');
  const { collection, demoted, message } = plotsRestore(s.result, plotId);
  store.setState({ result: collection, revision: s.revision + 1, notice: { tone: 'info', text: message } });
  return demoted;
}

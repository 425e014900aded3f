import { InputError } from '../core/common/InputError';
import { MAX_BUFFER_M, MAX_NOTE_LENGTH } from '../core/common/inputLimits';
import { fieldVariablesCheck } from '../core/field/fieldVariablesCheck';
import { plotsFieldEntry, plotsVisitClear, plotsVisitRecord } from '../core/field/plotVisit';
import type { FieldSetup, PositionFix } from '../core/model/fieldTypes';
import type { PlannerStore } from './plannerStore';

function design(store: PlannerStore) {
  const s = store.getState();
  if (!s.result) throw new InputError('this plan has no design yet: open a plan with plots, or a plot file');
  return { s, result: s.result };
}

/**
 * Records a visit to a plot now (or at `atIso`) by the plan's crew, with the device's position
 * when there is one; one undo step, kept on the plot like every field decision.
 */
export function fieldVisit(store: PlannerStore, plotId: string, fix: PositionFix | null, atIso = new Date().toISOString()): void {
  const { s, result } = design(store);
  const collection = plotsVisitRecord(result, plotId, { atIso, by: s.field.crew, fix });
  const where = fix ? ` at ±${Math.round(fix.accuracyM)} m` : ' (no position)';
  store.setState({ result: collection, revision: s.revision + 1, notice: { tone: 'info', text: `Plot ${plotId} recorded as visited${where}.` } });
}

/** Takes back a visit recorded by mistake; the measurements stay. */
export function fieldVisitClear(store: PlannerStore, plotId: string): void {
  const { s, result } = design(store);
  store.setState({ result: plotsVisitClear(result, plotId), revision: s.revision + 1, notice: { tone: 'info', text: `Visit to plot ${plotId} taken back.` } });
}

/** Keeps the measurements and note typed for a plot (see plotsFieldEntry); nothing changes when they are the same. */
export function fieldEntrySave(store: PlannerStore, plotId: string, values: Record<string, string>, note: string): void {
  const { s, result } = design(store);
  const collection = plotsFieldEntry(result, plotId, { values, note });
  const before = result.features.find((f) => f.properties.plot_id === plotId)?.properties;
  const after = collection.features.find((f) => f.properties.plot_id === plotId)?.properties;
  if (JSON.stringify([before?.field_values, before?.crew_note]) === JSON.stringify([after?.field_values, after?.crew_note])) return;
  store.setState({ result: collection, revision: s.revision + 1 });
}

/**
 * Changes the field setup: the crew name, the variables (checked by fieldVariablesCheck) and the
 * arrival radius (above 0, at most MAX_BUFFER_M metres).
 * @throws InputError saying what is wrong; the setup is then unchanged.
 */
export function fieldSetupSet(store: PlannerStore, patch: Partial<FieldSetup>): void {
  const s = store.getState();
  const next: FieldSetup = { ...s.field, ...patch };
  if (next.crew.length > MAX_NOTE_LENGTH) throw new InputError(`the crew name is longer than ${MAX_NOTE_LENGTH} characters`);
  if (!(next.arrivalRadiusM > 0 && next.arrivalRadiusM <= MAX_BUFFER_M)) throw new InputError(`the arrival radius must be above 0 and at most ${MAX_BUFFER_M} m`);
  next.variables = fieldVariablesCheck(next.variables);
  store.setState({ field: next, revision: s.revision + 1 });
}

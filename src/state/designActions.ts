import type { DesignSettings, PlotCollection } from '../core/model/designTypes';
import { InputError } from '../core/common/InputError';
import { designSettingsFieldsCheck } from '../core/design/designSettingsCheck';
import type { PlannerStore } from './plannerStore';

/** Changes design settings (not part of the undo history: undo steps through map edits only). */
export function designSettingsSet(store: PlannerStore, patch: Partial<DesignSettings>): void {
  const s = store.getState();
  for (const [name, value] of Object.entries(patch)) {
    if (typeof value === 'number' && !Number.isFinite(value)) throw new InputError(`design setting "${name}" must be a number`);
  }
  designSettingsFieldsCheck(patch);
  // Setting what is already set is no change (and no undo step).
  if (Object.entries(patch).every(([k, v]) => JSON.stringify(v) === JSON.stringify((s.design as unknown as Record<string, unknown>)[k]))) return;
  store.setState({ design: { ...s.design, ...patch }, revision: s.revision + 1 });
}

/** A fresh seed from the browser's cryptographic generator (shown to the user and stored in the plan). */
export function designSeedFresh(): number {
  const a = new Uint32Array(1);
  crypto.getRandomValues(a);
  return a[0];
}

/** Stores a finished design; earlier field decisions belong to the earlier design's plots and go with them. */
export function designResultSet(store: PlannerStore, result: PlotCollection): void {
  const s = store.getState();
  store.setState({ result, resultStale: false, job: null, revision: s.revision + 1 });
}


import type { DesignSettings, PlotCollection } from '../core/model/designTypes';
import { InputError } from '../core/common/InputError';
import type { PlannerStore } from './plannerStore';

/** Changes design settings (not part of the undo history: undo steps through map edits only). */
export function designSettingsSet(store: PlannerStore, patch: Partial<DesignSettings>): void {
  const s = store.getState();
  for (const [name, value] of Object.entries(patch)) {
    if (typeof value === 'number' && !Number.isFinite(value)) throw new InputError(`design setting "${name}" must be a number`);
  }
  if (patch.plots !== undefined && !(Number.isInteger(patch.plots) && patch.plots >= 1)) throw new InputError('total plots must be a whole number, 1 or more');
  if (patch.spacingM !== undefined && patch.spacingM < 0) throw new InputError('spacing must be 0 m or more');
  if (patch.edgeBufferM !== undefined && patch.edgeBufferM < 0) throw new InputError('edge buffer must be 0 m or more');
  if (patch.reservePerStratum !== undefined && !(Number.isInteger(patch.reservePerStratum) && patch.reservePerStratum >= 0)) {
    throw new InputError('reserves per stratum must be a whole number, 0 or more');
  }
  if (patch.seed !== undefined && !(Number.isInteger(patch.seed) && patch.seed >= 0 && patch.seed <= 0xffffffff)) {
    throw new InputError('seed must be a whole number from 0 to 4294967295');
  }
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

/** Clears the design result and its field decisions. */
export function designResultClear(store: PlannerStore): void {
  const s = store.getState();
  store.setState({ result: null, resultStale: false, revision: s.revision + 1 });
}

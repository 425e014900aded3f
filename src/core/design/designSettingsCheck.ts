import type { DesignSettings } from '../model/designTypes';
import { InputError } from '../common/InputError';

const ALLOCATIONS = ['proportional', 'equal', 'neyman'];
const METHODS = ['random', 'balanced', 'grid', 'transect'];

function nonNegative(v: number, what: string): void {
  if (!(Number.isFinite(v) && v >= 0)) throw new InputError(`${what} must be a number ≥ 0, got ${v}`);
}

function wholeNonNegative(v: number, what: string): void {
  if (!(Number.isInteger(v) && v >= 0)) throw new InputError(`${what} must be a whole number ≥ 0, got ${v}`);
}

/** The largest seed: seeds are unsigned 32-bit whole numbers, as the planner draws them. */
export const SEED_MAX = 0xffffffff;

/**
 * Checks each design setting given on its own (a whole design or a change to one): counts whole
 * and ≥ 0, distances ≥ 0, known allocation and placement methods, the seed a whole number from 0
 * to {@link SEED_MAX}, the random generator version, SDs ≥ 0, costs > 0, a target half-width and a
 * budget > 0. The one wording of these rules: the planner's forms and the CLI both show it.
 * Throws InputError for the first problem found.
 */
export function designSettingsFieldsCheck(s: Partial<DesignSettings>): void {
  if (s.allocation !== undefined && !ALLOCATIONS.includes(s.allocation)) throw new InputError(`allocation "${s.allocation}" is not one of ${ALLOCATIONS.join(', ')}`);
  if (s.method !== undefined && !METHODS.includes(s.method)) throw new InputError(`placement method "${s.method}" is not one of ${METHODS.join(', ')}`);
  if (s.shareBasis !== undefined && s.shareBasis !== 'usable' && s.shareBasis !== 'mapped') throw new InputError(`share basis "${s.shareBasis}" is not usable or mapped`);
  if (s.plots !== undefined) wholeNonNegative(s.plots, 'number of plots');
  if (s.minPerStratum !== undefined) wholeNonNegative(s.minPerStratum, 'minimum plots per stratum');
  if (s.reservePerStratum !== undefined) wholeNonNegative(s.reservePerStratum, 'reserve plots per stratum');
  if (s.spacingM !== undefined) nonNegative(s.spacingM, 'minimum spacing (m)');
  if (s.edgeBufferM !== undefined) nonNegative(s.edgeBufferM, 'edge buffer (m)');
  if (s.seed !== undefined && !(Number.isInteger(s.seed) && s.seed >= 0 && s.seed <= SEED_MAX)) {
    throw new InputError(`seed must be a whole number from 0 to ${SEED_MAX}, got ${s.seed}`);
  }
  if (s.rngVersion !== undefined && s.rngVersion !== 1 && s.rngVersion !== 2 && s.rngVersion !== 3) {
    throw new InputError(`random generator version must be 1, 2 or 3, got ${String(s.rngVersion)}`);
  }
  if (s.gridAngleDeg !== undefined && !Number.isFinite(s.gridAngleDeg)) throw new InputError(`grid angle must be a number of degrees, got ${s.gridAngleDeg}`);
  for (const [key, v] of Object.entries(s.sd ?? {})) nonNegative(v, `pilot standard deviation of stratum "${key}"`);
  for (const [key, v] of Object.entries(s.cost ?? {})) {
    if (!(Number.isFinite(v) && v > 0)) throw new InputError(`relative cost of stratum "${key}" must be a number > 0, got ${v}`);
  }
  if (s.targetHalfwidth && !(Number.isFinite(s.targetHalfwidth.value) && s.targetHalfwidth.value > 0)) {
    throw new InputError(`target half-width must be a number > 0, got ${s.targetHalfwidth.value}`);
  }
  if (s.budget) {
    if (!(Number.isFinite(s.budget.total) && s.budget.total > 0)) throw new InputError(`the budget must be a number > 0, got ${s.budget.total}`);
    if (!(Number.isFinite(s.budget.overhead) && s.budget.overhead >= 0)) throw new InputError(`the fixed overhead must be a number ≥ 0, got ${s.budget.overhead}`);
  }
  if (s.gridSpacingM !== undefined && s.gridSpacingM !== null && !(s.gridSpacingM > 0)) throw new InputError(`grid spacing must be more than 0 m, got ${s.gridSpacingM}`);
}

/**
 * Checks a whole design before any work, so an impossible request fails with a message naming the
 * setting: every setting on its own ({@link designSettingsFieldsCheck}), then what each method
 * needs (a relative target → pilot mean, a target or budget only for random or balanced designs,
 * not both, transect → baseline and intervals).
 * Throws InputError for the first problem found.
 */
export function designSettingsCheck(s: DesignSettings): void {
  designSettingsFieldsCheck(s.targetHalfwidth || s.budget ? { ...s, plots: undefined } : s);
  if (s.targetHalfwidth) {
    if (s.targetHalfwidth.relative && !(s.pilotMean !== null && Number.isFinite(s.pilotMean) && s.pilotMean > 0)) {
      throw new InputError('a relative target half-width (X%) needs a pilot mean > 0 (--pilot-mean)');
    }
    if (s.method === 'grid' || s.method === 'transect') {
      throw new InputError(`a target half-width sizes random or balanced designs; the ${s.method} method's size is set by its spacing`);
    }
  }
  if (s.budget) {
    if (s.targetHalfwidth) throw new InputError('size the design by a target half-width or by a budget, not both');
    if (s.method === 'grid' || s.method === 'transect') {
      throw new InputError(`a budget sizes random or balanced designs; the ${s.method} method's size is set by its spacing`);
    }
  }
  if (s.method === 'transect') {
    if (!s.baseline || s.baseline.length < 2) throw new InputError('the transect method needs a baseline line (--baseline FILE)');
    if (!(s.transectIntervalM !== null && s.transectIntervalM > 0)) throw new InputError('the transect method needs a transect interval > 0 m (--transect-interval)');
    if (!(s.quadratIntervalM !== null && s.quadratIntervalM > 0)) throw new InputError('the transect method needs a quadrat interval > 0 m (--quadrat-interval)');
  }
}

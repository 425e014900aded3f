import type { DesignSettings } from '../model/designTypes';
import { RNG_VERSION_CURRENT } from './place/rng';

/**
 * The settings a new design starts from: 30 proportional plots by usable area, at least 2 per
 * stratum, point plots, no spacing, no reserves, simple random placement, seed 1 and the current
 * random generator version. Every value is
 * a starting point, not advice for any particular survey (common practice, no source).
 * @param overrides settings to change; a key given as undefined keeps its default (so a CLI can pass
 *   every option it read, given or not)
 */
export function designSettingsDefault(overrides: Partial<DesignSettings> = {}): DesignSettings {
  return {
    plots: 30,
    allocation: 'proportional',
    shareBasis: 'usable',
    minPerStratum: 2,
    sd: {},
    cost: {},
    targetHalfwidth: null,
    budget: null,
    pilotMean: null,
    spacingM: 0,
    footprint: { shape: 'point' },
    edgeBufferM: 0,
    reservePerStratum: 0,
    method: 'random',
    gridSpacingM: null,
    gridAngleDeg: 0,
    baseline: null,
    transectIntervalM: null,
    quadratIntervalM: null,
    seed: 1,
    rngVersion: RNG_VERSION_CURRENT,
    redistributeShortfall: false,
    ...definedOf(overrides),
  };
}

function definedOf<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

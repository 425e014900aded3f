import type { DesignSettings } from '../core/designTypes';

/** Design settings for store tests: a small proportional random design (common practice, no source). */
export const TEST_DESIGN: DesignSettings = {
  plots: 10,
  allocation: 'proportional',
  shareBasis: 'usable',
  minPerStratum: 2,
  sd: {},
  cost: {},
  targetHalfwidth: null,
  pilotMean: null,
  spacingM: 20,
  footprint: { shape: 'square', sideM: 10, angleDeg: 0 },
  edgeBufferM: 0,
  reservePerStratum: 2,
  method: 'random',
  gridSpacingM: null,
  gridAngleDeg: 0,
  baseline: null,
  transectIntervalM: null,
  quadratIntervalM: null,
  seed: 42,
};

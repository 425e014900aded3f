import { designSettingsDefault } from '../core/design/designSettingsDefault';
import type { DesignSettings } from '../core/model/designTypes';

/** Design settings for store tests: a small proportional random design (common practice, no source). */
export const TEST_DESIGN: DesignSettings = designSettingsDefault({
  plots: 10,
  spacingM: 20,
  footprint: { shape: 'square', sideM: 10, angleDeg: 0 },
  reservePerStratum: 2,
  seed: 42,
});

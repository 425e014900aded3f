import { describe, expect, it } from 'vitest';
import { stratumNamesInText } from './stratumNamesInText';

describe('stratumNamesInText', () => {
  it('gives a renamed stratum quoted by its id its current name, and leaves other quotes alone', () => {
    const strata = [
      { key: 'Stratum 7', label: 'Farm paddock' },
      { key: 'Coastal heath', label: 'Coastal heath' },
    ];
    expect(stratumNamesInText('stratum "Coastal heath" overlaps feature 6 in stratum "Stratum 7" by 8604.54 m²', strata)).toBe(
      'stratum "Coastal heath" overlaps feature 6 in stratum "Farm paddock" by 8604.54 m²',
    );
    expect(stratumNamesInText('the file "Stratum 7.geojson" has no "Stratum 8"', strata)).toBe('the file "Stratum 7.geojson" has no "Stratum 8"');
  });
});

import { describe, expect, it } from 'vitest';
import { countNoun } from './countNoun';

describe('countNoun', () => {
  // English number agreement (common practice, no source): singular for exactly one, plural otherwise.
  it('uses the singular for one and the plural for none and many', () => {
    expect(countNoun(1, 'polygon')).toBe('1 polygon');
    expect(countNoun(0, 'polygon')).toBe('0 polygons');
    expect(countNoun(2, 'stratum', 'strata')).toBe('2 strata');
    expect(countNoun(1, 'stratum', 'strata')).toBe('1 stratum');
    expect(countNoun(12000, 'plot')).toBe('12,000 plots');
  });
});

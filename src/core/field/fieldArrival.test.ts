import { describe, expect, it } from 'vitest';
import { fieldArrival } from './fieldArrival';

// The rule (radius never smaller than the accuracy) is common practice, no source.
describe('fieldArrival', () => {
  it('arrives within the radius set and not beyond it', () => {
    expect(fieldArrival(4.99, 5, 3)).toEqual({ arrived: true, radiusM: 5, widened: false });
    expect(fieldArrival(5, 5, 3).arrived).toBe(true);
    expect(fieldArrival(5.01, 5, 3).arrived).toBe(false);
  });

  it('widens the radius to the accuracy of the position, and says so', () => {
    expect(fieldArrival(10, 5, 12)).toEqual({ arrived: true, radiusM: 12, widened: true });
    expect(fieldArrival(12.5, 5, 12).arrived).toBe(false);
  });

  it('ignores an accuracy that is missing or not a number', () => {
    expect(fieldArrival(4, 5, Number.NaN)).toEqual({ arrived: true, radiusM: 5, widened: false });
  });
});

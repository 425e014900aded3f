import { describe, expect, it } from 'vitest';
import { haltonValue } from './halton';

describe('haltonValue', () => {
  it('gives the first eight base-2 terms of Halton (1960) listed in docs/references.md §5', () => {
    const expected = [1 / 2, 1 / 4, 3 / 4, 1 / 8, 5 / 8, 3 / 8, 7 / 8, 1 / 16];
    expected.forEach((v, i) => {
      expect(haltonValue(i + 1, 2)).toBe(v);
    });
  });

  it('gives the first eight base-3 terms of Halton (1960) listed in docs/references.md §5', () => {
    const expected = [1 / 3, 2 / 3, 1 / 9, 4 / 9, 7 / 9, 2 / 9, 5 / 9, 8 / 9];
    expected.forEach((v, i) => {
      expect(haltonValue(i + 1, 3)).toBeCloseTo(v, 15);
    });
  });

  it('refuses a negative index and a base below 2', () => {
    expect(() => haltonValue(-1, 2)).toThrow(RangeError);
    expect(() => haltonValue(3, 1)).toThrow(RangeError);
  });
});

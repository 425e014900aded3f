import { describe, expect, it } from 'vitest';
import { collapseStrata } from './collapseStrata';

const s = (stratum: string, values: number[], basisM2 = 1) => ({ stratum, basisM2, values });

describe('collapseStrata', () => {
  it('leaves strata with at least two observations alone', () => {
    const r = collapseStrata([s('a', [1, 2]), s('b', [3, 4])]);
    expect(r.strata.map((g) => g.stratum)).toEqual(['a', 'b']);
    expect(r.merged).toEqual([]);
  });

  it('merges a single-plot stratum with the next one in list order', () => {
    const r = collapseStrata([s('a', [1, 2]), s('b', [5], 2), s('c', [7, 8], 3)]);
    expect(r.strata.map((g) => g.stratum)).toEqual(['a', 'b + c']);
    expect(r.strata[1].basisM2).toBe(5);
    expect(r.strata[1].values).toEqual([5, 7, 8]);
    expect(r.strata[1].members).toEqual(['b', 'c']);
    expect(r.merged[0]).toBe('b (n = 1) merged with c');
  });

  it('merges the last stratum with the previous one', () => {
    const r = collapseStrata([s('a', [1, 2]), s('b', [3, 4]), s('c', [])]);
    expect(r.strata.map((g) => g.stratum)).toEqual(['a', 'b + c']);
  });

  it('keeps merging until every stratum has two observations', () => {
    const r = collapseStrata([s('a', [1]), s('b', []), s('c', [2]), s('d', [3, 4])]);
    expect(r.strata.every((g) => g.values.length >= 2)).toBe(true);
    expect(r.strata.flatMap((g) => g.members)).toEqual(['a', 'b', 'c', 'd']);
  });

  it('does not change its input', () => {
    const input = [s('a', [1]), s('b', [2, 3])];
    collapseStrata(input);
    expect(input[0].values).toEqual([1]);
  });
});

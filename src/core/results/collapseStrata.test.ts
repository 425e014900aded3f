import { describe, expect, it } from 'vitest';
import { collapseStrata } from './collapseStrata';

const c = (stratum: string, n: number) => ({ stratum, n });

describe('collapseStrata', () => {
  it('leaves strata with at least two observations alone', () => {
    const r = collapseStrata([c('a', 2), c('b', 5)]);
    expect(r.groups).toEqual([]);
    expect(r.merged).toEqual([]);
  });

  it('groups a single-plot stratum with the next one in list order', () => {
    const r = collapseStrata([c('a', 2), c('b', 1), c('c', 2)]);
    expect(r.groups).toEqual([{ indices: [1, 2], strata: ['b', 'c'] }]);
    expect(r.merged).toEqual(['b (n = 1) + c (n = 2)']);
  });

  it('groups the last stratum with the previous one', () => {
    const r = collapseStrata([c('a', 2), c('b', 3), c('c', 1)]);
    expect(r.groups).toEqual([{ indices: [1, 2], strata: ['b', 'c'] }]);
  });

  it('pairs two single-plot neighbours, the textbook case of one unit per stratum', () => {
    const r = collapseStrata([c('a', 1), c('b', 1), c('c', 1), c('d', 1)]);
    expect(r.groups.map((g) => g.strata)).toEqual([
      ['a', 'b'],
      ['c', 'd'],
    ]);
  });

  it('skips strata without observations: collapsing gives them no mean', () => {
    const r = collapseStrata([c('a', 1), c('b', 0), c('c', 4)]);
    expect(r.groups.map((g) => g.strata)).toEqual([['a', 'c']]);
  });
});

import { describe, expect, it } from 'vitest';
import { PLOT_ID_MAX_LENGTH, plotCodesUnique, plotIdsFor } from './plotIds';

const info = (key: string, code: string) => ({ key, label: key, code, colour: '#000000' });

describe('plotIdsFor', () => {
  it('writes primaries as CODE-07 and reserves as CODE-R2', () => {
    const ids = plotIdsFor([info('Coastal heath', 'HEA')], [12], [3]);
    expect(ids[0].primary[6]).toBe('HEA-07');
    expect(ids[0].reserve).toEqual(['HEA-R1', 'HEA-R2', 'HEA-R3']);
  });

  it('keeps every id within 10 characters and unique even with long, clashing codes and many plots', () => {
    const ids = plotIdsFor([info('a', 'WOODLANDTALL'), info('b', 'WOODLANDTALL'), info('c', '')], [12000, 5, 5], [30, 1, 1]);
    const all = ids.flatMap((s) => [...s.primary, ...s.reserve]);
    expect(new Set(all).size).toBe(all.length);
    for (const id of all) expect(id.length).toBeLessThanOrEqual(PLOT_ID_MAX_LENGTH);
  });
});

describe('plotCodesUnique', () => {
  it('cleans codes to A–Z and 0–9 and numbers repeats', () => {
    expect(plotCodesUnique([info('x', 'he-a'), info('y', 'HEA'), info('z', 'HEA')], 3)).toEqual(['HEA', 'HE2', 'HE3']);
  });
});

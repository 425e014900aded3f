import { describe, expect, it } from 'vitest';
import { featureIdsUnique } from './featureIdsUnique';

const point = (id: string | number | undefined, propId?: string) => ({
  type: 'Feature' as const,
  id,
  properties: propId === undefined ? {} : { id: propId },
  geometry: { type: 'Point' as const, coordinates: [0, 0] },
});

describe('featureIdsUnique', () => {
  it('keeps ids used once, blanks ids used twice and missing ones (common practice, no source)', () => {
    expect(featureIdsUnique([point('a'), point(7), point('b'), point(undefined, 'b'), point(undefined)])).toEqual(['a', '7', '', '', '']);
  });
});

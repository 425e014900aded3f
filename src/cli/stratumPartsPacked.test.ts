import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { strataFromFeatures } from '../io/site/strataFromFeatures';
import { stratumPartsPack, stratumPartsUnpack } from './stratumPartsPacked';

const root = join(import.meta.dirname, '../..');

describe('stratumPartsPack', () => {
  it('gives back every part with the same lon/lat numbers, Polygon and MultiPolygon, holes included', () => {
    const fc = JSON.parse(readFileSync(join(root, 'demo-maps/ochre-spit-strata.geojson'), 'utf8'));
    const { parts } = strataFromFeatures(fc, { fileName: 'strata' });
    // A MultiPolygon with a hole, and −0, which must come back as −0.
    parts.push({
      id: 'multi',
      stratum: parts[0].stratum,
      geometry: {
        type: 'MultiPolygon',
        coordinates: [
          [
            [[118, -34], [118.01, -34], [118.01, -33.99], [118, -34]],
            [[118.002, -33.998], [118.004, -33.998], [118.004, -33.996], [118.002, -33.998]],
          ],
          [[[-0, -0], [0.001, 0], [0, 0.001], [-0, -0]]],
        ],
      },
    });
    const back = stratumPartsUnpack(stratumPartsPack(parts));
    expect(back.map((p) => [p.id, p.stratum, p.geometry.type])).toEqual(parts.map((p) => [p.id, p.stratum, p.geometry.type]));
    back.forEach((p, i) => {
      const a = JSON.stringify(p.geometry.coordinates);
      const b = JSON.stringify(parts[i].geometry.coordinates);
      expect(a).toBe(b);
    });
    const last = back[back.length - 1].geometry.coordinates as number[][][][];
    expect(Object.is(last[1][0][0][0], -0)).toBe(true);
  });
});

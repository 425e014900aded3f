import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { Footprint } from '../model/designTypes';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { FIT_EXCLUDED, FIT_NEAR_EDGE, FIT_OK, FIT_OUTSIDE_STRATUM, placementConstraintsBuild } from '../design/place/placementConstraints';
import { plotClearances } from './plotClearances';
import { rngCreate } from '../design/place/rng';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import type { Site } from '../model/types';

const FOOTPRINTS: Footprint[] = [
  { shape: 'point' },
  { shape: 'square', sideM: 20, angleDeg: 0 },
  { shape: 'rect', widthM: 30, heightM: 8, angleDeg: 35 },
  { shape: 'circle', radiusM: 6 },
];

describe('plotClearances', () => {
  it('refuses exactly the positions placement refuses, for the same reason (seeded invented sites, every footprint)', () => {
    // An invariant of the code, no outside source: the check must agree with placement point for point.
    const seen = { outside: 0, edge: 0, excluded: 0, ok: 0 };
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 10_000 }), fc.constantFrom(...FOOTPRINTS), fc.constantFrom(0, 4), (seed, footprint, edgeBufferM) => {
        const site = siteInventedRandom(seed, 3, 6);
        const frame = siteLocalFrame(site.parts);
        const c = placementConstraintsBuild(site, frame, { footprint, edgeBufferM });
        const clear = plotClearances(c, 0);
        const box = c.strata.reduce((b, s) => [Math.min(b[0], s.bbox[0]), Math.min(b[1], s.bbox[1]), Math.max(b[2], s.bbox[2]), Math.max(b[3], s.bbox[3])], [Infinity, Infinity, -Infinity, -Infinity]);
        const rng = rngCreate(seed);
        for (let k = 0; k < 300; k++) {
          const x = box[0] + rng.float() * (box[2] - box[0]);
          const y = box[1] + rng.float() * (box[3] - box[1]);
          const s = clear.stratumAt(x, y);
          if (s < 0) {
            for (let t = 0; t < c.strata.length; t++) expect(c.check(t, x, y)).toBe(FIT_OUTSIDE_STRATUM);
            seen.outside++;
            continue;
          }
          const fit = c.check(s, x, y);
          const edge = clear.edge(s, x, y);
          const excluded = clear.blocking(x, y).length > 0;
          const want = edge?.blocks ? FIT_NEAR_EDGE : excluded ? FIT_EXCLUDED : FIT_OK;
          expect(fit).toBe(want);
          seen[want === FIT_NEAR_EDGE ? 'edge' : want === FIT_EXCLUDED ? 'excluded' : 'ok']++;
        }
      }),
      { numRuns: 12, seed: 16 },
    );
    // Every branch was exercised.
    expect(Math.min(seen.outside, seen.edge, seen.excluded, seen.ok)).toBeGreaterThan(10);
  });

  it('measures a plot 10 m from a hazard point with a 30 m buffer, and lets positive limits be met to within the slack', () => {
    const site: Site = {
      name: 'invented square',
      strata: [{ key: 'A', label: 'A', code: 'AAA', colour: '#336699' }],
      parts: [{ id: 'a', stratum: 'A', geometry: { type: 'Polygon', coordinates: [[[147, -35], [147.01, -35], [147.01, -34.99], [147, -34.99], [147, -35]]] } }],
      exclusions: [{ id: 'h', kind: 'hazard', bufferM: 30, geometry: { type: 'Point', coordinates: [147.005, -34.995] } }],
      access: [],
      boundary: null,
    };
    const frame = siteLocalFrame(site.parts);
    const c = placementConstraintsBuild(site, frame, { footprint: { shape: 'point' }, edgeBufferM: 0 });
    const [hx, hy] = frame.toXY(147.005, -34.995);
    const k = c.scale;
    const near = plotClearances(c).blocking(hx + 10, hy);
    expect(near).toHaveLength(1);
    // 10 grid metres are 10 / (point scale factor) ground metres; the zone's factor is within 0.1 % of 1 (Snyder 1987, eq. 8-11).
    expect(near[0].centreM).toBeCloseTo(10, 1);
    // Just short of the 30 m buffer (by 1 cm): placement refuses it, the check with a 2 cm allowance does not.
    const justShort = hx + 30 * k - 0.01;
    expect(c.check(0, justShort, hy)).toBe(FIT_EXCLUDED);
    expect(plotClearances(c, 0).blocking(justShort, hy)).toHaveLength(1);
    expect(plotClearances(c, 0.02).blocking(justShort, hy)).toHaveLength(0);
    expect(plotClearances(c, 0.02).blocking(hx + 30 * k - 1, hy)).toHaveLength(1);
  });
});

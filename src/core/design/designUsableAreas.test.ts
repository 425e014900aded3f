import { describe, expect, it } from 'vitest';
import { designUsableAreas } from './designUsableAreas';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import { stratumUsableRegion } from '../site/stratumUsableRegion';

describe('designUsableAreas', () => {
  it('agrees with stratumUsableRegion of each whole stratum, and mapped with polygonAreaM2 of its parts', () => {
    for (const seed of [1, 2, 3]) {
      const site = siteInventedRandom(seed, 4, 8);
      const frame = siteLocalFrame(site.parts);
      const { mapped, usable } = designUsableAreas(site, frame);
      site.strata.forEach((s, i) => {
        const parts = site.parts.filter((p) => p.stratum === s.key);
        expect(mapped[i]).toBeCloseTo(parts.reduce((a, p) => a + polygonAreaM2(p.geometry), 0), 3);
        expect(usable[i]).toBeCloseTo(stratumUsableRegion(site, s.key, frame).areaM2, 0);
        expect(usable[i]).toBeLessThanOrEqual(mapped[i] + 1e-6);
      });
    }
  });
});

describe('designUsableAreas on many seeded sites', () => {
  it('stays within 1e-5 of each stratum\'s area of clipping the whole stratum with merged buffers', () => {
    // Reference: stratumUsableRegion (polyclip-ts 0.16.8 difference with JTS-merged buffers, then
    // polygonAreaM2). The measuring itself agrees with a clipper to 1e-6 (polygonCoveredAreaM2 tests);
    // the rest is the two drawings of each buffer arc, both within ARC_TOLERANCE_M of the true circle.
    for (const seed of [5, 6, 7, 8, 9, 10]) {
      const site = siteInventedRandom(seed, 5, 12);
      const frame = siteLocalFrame(site.parts);
      const { mapped, usable, warnings } = designUsableAreas(site, frame);
      expect(warnings).toEqual([]);
      site.strata.forEach((s, i) => {
        expect(Math.abs(usable[i] - stratumUsableRegion(site, s.key, frame).areaM2)).toBeLessThan(1e-5 * mapped[i]);
      });
    }
  });
});

describe('usableAreaByGrid', () => {
  it('counts the same usable area as exact clipping, within its stated error', async () => {
    const { usableAreaByGrid } = await import('./usableAreaByGrid');
    const site = siteInventedRandom(4, 2, 6);
    const frame = siteLocalFrame(site.parts);
    const one = { ...site, parts: [site.parts[2]], strata: [site.strata[1]] };
    const exact = stratumUsableRegion(one, 'S1', frame).areaM2;
    const est = usableAreaByGrid(one, frame, polygonAreaM2(site.parts[2].geometry));
    expect(Math.abs(est.areaM2 - exact)).toBeLessThanOrEqual(est.errorM2 + 1);
  });
});

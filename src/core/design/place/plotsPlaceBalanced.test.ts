import { describe, expect, it } from 'vitest';
import { designRun } from '../designRun';
import { designSettingsDefault } from '../designSettingsDefault';
import { siteInventedRandom } from '../../fixtures/siteInventedRandom';
import { localFrameAt } from '../../geo/localFrame';
import { placementConstraintsBuild } from './placementConstraints';
import { plotsPlaceBalanced } from './plotsPlaceBalanced';
import { rngCreate } from './rng';
import { stratumUsableRegion } from '../../site/stratumUsableRegion';
import { siteLocalFrame } from '../../geo/siteLocalFrame';

function inRings(rings: number[][][], x: number, y: number): boolean {
  let inside = false;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i];
      const [xj, yj] = ring[j];
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

describe('balanced acceptance sampling', () => {
  it('puts every kept plot inside the usable region of its stratum (checked against stratumUsableRegion)', () => {
    const site = siteInventedRandom(11, 3, 6);
    const r = designRun(site, designSettingsDefault({ plots: 40, method: 'balanced', reservePerStratum: 2, seed: 4 }));
    const frame = siteLocalFrame(site.parts);
    const regions = Object.fromEntries(site.strata.map((s) => [s.key, stratumUsableRegion(site, s.key, frame).xy]));
    expect(r.features.length).toBe(46);
    for (const f of r.features) {
      const p = f.properties;
      const [x, y] = frame.toXY(p.lon, p.lat);
      expect(regions[p.stratum].some((poly) => inRings(poly, x, y)), p.plot_id).toBe(true);
    }
  });

  it('follows the Halton sequence (bases 2, 3) from a random start over the stratum box', () => {
    const site = siteInventedRandom(3, 2, 0);
    const frame = localFrameAt(site.parts[0].geometry.coordinates[0][0][0] as number, site.parts[0].geometry.coordinates[0][0][1] as number);
    const c = placementConstraintsBuild(site, frame, { footprint: { shape: 'point' }, edgeBufferM: 0 });
    const src = plotsPlaceBalanced(c, 0, rngCreate(1));
    const [x0, y0, x1, y1] = c.strata[0].bbox;
    const out = new Float64Array(2);
    const us: number[] = [];
    const vs: number[] = [];
    for (let k = 0; k < 8; k++) {
      src.next(out);
      us.push((out[0] - x0) / (x1 - x0));
      vs.push((out[1] - y0) / (y1 - y0));
    }
    // Consecutive base-2 terms (docs/references.md §5) differ by halves, quarters, eighths…: any 2 consecutive
    // terms from a random start fall in different halves of [0, 1), any 4 in different quarters.
    expect(new Set(us.slice(0, 2).map((u) => Math.floor(u * 2))).size).toBe(2);
    expect(new Set(us.slice(0, 4).map((u) => Math.floor(u * 4))).size).toBe(4);
    expect(new Set(vs.slice(0, 3).map((v) => Math.floor(v * 3))).size).toBe(3);
    expect(new Set(vs.slice(0, 9).map((v) => Math.floor(v * 9))).size).toBeGreaterThanOrEqual(8);
  });
});

import { booleanPointInPolygon, multiPolygon } from '@turf/turf';
import type { Position } from 'geojson';
import { jStat } from 'jstat';
import * as polyclip from 'polyclip-ts';
import { describe, expect, it } from 'vitest';
import { designRun } from '../designRun';
import { designSettingsDefault } from '../designSettingsDefault';
import { localFrameAt } from '../../geo/localFrame';
import type { Site } from '../../model/types';

// An invented stratum in frame metres: a 14-pointed star with a hole near its middle, and a small
// second patch 300 m east of it (a MultiPolygon), so bins see concave edges, a hole and a gap.
// The checks and their sources are listed in docs/references.md §8.
const frame = localFrameAt(117.9, -35.02);
const [e0, n0] = frame.toXY(117.9, -35.02);
const star: [number, number][] = [];
for (let i = 0; i < 28; i++) {
  const r = i % 2 === 0 ? 500 : 210;
  const t = (Math.PI * i) / 14 + 0.1;
  star.push([500 + r * Math.cos(t), 500 + r * Math.sin(t)]);
}
const hole: [number, number][] = [[420, 440], [430, 590], [560, 570], [590, 430]];
const patch: [number, number][] = [[1300, 300], [1500, 320], [1480, 700], [1320, 660]];
const closed = (ring: [number, number][]) => [...ring, ring[0]];
const lonLat = (ring: [number, number][]): Position[] => closed(ring).map(([x, y]) => frame.toLonLat(e0 + x, n0 + y));
const polygonsXY = [[closed(star), closed(hole)], [closed(patch)]];
const polygons = [[lonLat(star), lonLat(hole)], [lonLat(patch)]];
const site: Site = {
  name: 'star and patch (invented)',
  strata: [{ key: 'S', label: 'Star heath', code: 'STA', colour: '#888888' }],
  parts: [{ id: 's', stratum: 'S', geometry: { type: 'MultiPolygon', coordinates: polygons } }],
  exclusions: [],
  access: [],
  boundary: null,
};

/** Planar area of polyclip's output rings (shoelace, holes negative by their winding). */
function areaXY(mp: polyclip.Geom): number {
  let a = 0;
  for (const poly of mp as [number, number][][][]) {
    for (const ring of poly) for (let i = 0; i + 1 < ring.length; i++) a += (ring[i][0] * ring[i + 1][1] - ring[i + 1][0] * ring[i][1]) / 2;
  }
  return a;
}

describe('random placement from the cell grid (generator version 3)', () => {
  it('spreads plots over a concave stratum with a hole and two patches in proportion to the area of each bin (χ², 0.001)', () => {
    const cols = 8;
    const rows = 5;
    const [x0, y0, x1, y1] = [0, 0, 1520, 1000];
    const total = areaXY(polyclip.union(polygonsXY as polyclip.Geom));
    const share: number[] = [];
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < cols; c++) {
        const bx = x0 + ((x1 - x0) * c) / cols;
        const by = y0 + ((y1 - y0) * r) / rows;
        const bin: [number, number][] = [[bx, by], [bx + (x1 - x0) / cols, by], [bx + (x1 - x0) / cols, by + (y1 - y0) / rows], [bx, by + (y1 - y0) / rows], [bx, by]];
        share.push(areaXY(polyclip.intersection(polygonsXY as polyclip.Geom, [bin])) / total);
      }
    }
    expect(share.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 9);
    const counts = new Array<number>(share.length).fill(0);
    const turfStratum = multiPolygon(polygons);
    let outside = 0;
    let n = 0;
    for (let seed = 1; seed <= 16; seed++) {
      const r = designRun(site, designSettingsDefault({ plots: 500, minPerStratum: 0, reservePerStratum: 0, seed, rngVersion: 3 }));
      for (const f of r.features) {
        if (!booleanPointInPolygon(f.geometry.coordinates, turfStratum)) outside++;
        const [x, y] = frame.toXY(f.geometry.coordinates[0], f.geometry.coordinates[1]);
        const c = Math.min(cols - 1, Math.floor(((x - e0 - x0) / (x1 - x0)) * cols));
        const rr = Math.min(rows - 1, Math.floor(((y - n0 - y0) / (y1 - y0)) * rows));
        counts[rr * cols + c]++;
        n++;
      }
    }
    expect(n).toBe(8000);
    expect(outside).toBe(0);
    // Bins expecting fewer than 5 plots are pooled into one, as the χ² approximation asks (common practice).
    let chi = 0;
    let bins = 0;
    let pooledObserved = 0;
    let pooledExpected = 0;
    for (let i = 0; i < share.length; i++) {
      const expected = share[i] * n;
      if (expected === 0) expect(counts[i]).toBe(0);
      else if (expected < 5) {
        pooledObserved += counts[i];
        pooledExpected += expected;
      } else {
        chi += (counts[i] - expected) ** 2 / expected;
        bins++;
      }
    }
    if (pooledExpected > 0) {
      chi += (pooledObserved - pooledExpected) ** 2 / pooledExpected;
      bins++;
    }
    // Upper 0.001 point from jstat 1.9.6 chisquare.inv (docs/references.md §7 checks it against tables).
    expect(chi).toBeLessThan(jStat.chisquare.inv(0.999, bins - 1));
    expect(bins).toBeGreaterThan(20);
  });

  it('keeps the minimum spacing and stops short, with the refusals counted, when the stratum is full', () => {
    const r = designRun(site, designSettingsDefault({ plots: 300, minPerStratum: 0, reservePerStratum: 0, spacingM: 60, seed: 3, rngVersion: 3 }));
    const xy = r.features.map((f) => frame.toXY(f.geometry.coordinates[0], f.geometry.coordinates[1]));
    let closest = Infinity;
    for (let i = 0; i < xy.length; i++) for (let j = i + 1; j < xy.length; j++) closest = Math.min(closest, Math.hypot(xy[i][0] - xy[j][0], xy[i][1] - xy[j][1]));
    // Coordinates are written to 1e-7 degrees (about a centimetre).
    expect(closest).toBeGreaterThan(60 - 0.05);
    expect(xy.length).toBeLessThan(300);
    expect(r.design.warnings.join(' ')).toMatch(/holds only \d+ of its 300 plots .*closer than the minimum spacing/);
  });
});

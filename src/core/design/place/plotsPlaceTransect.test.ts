import { describe, expect, it } from 'vitest';
import { designRun } from '../designRun';
import { designSettingsDefault } from '../designSettingsDefault';
import { localFrameAt } from '../../geo/localFrame';
import type { Site } from '../../model/types';

const frame = localFrameAt(117.9, -35.02);
const [e0, n0] = frame.toXY(117.9, -35.02);
const ll = (x: number, y: number) => frame.toLonLat(e0 + x, n0 + y);
const box = (x0: number, y0: number, x1: number, y1: number) => [ll(x0, y0), ll(x1, y0), ll(x1, y1), ll(x0, y1), ll(x0, y0)];
/** Invented: a 1000 × 300 m stratum north of an east-running baseline along its southern edge. */
const site: Site = {
  name: 'invented',
  strata: [{ key: 'T', label: 'T', code: 'TRN', colour: '#000000' }],
  parts: [{ id: 't', stratum: 'T', geometry: { type: 'Polygon', coordinates: [box(0, 0, 1000, 300)] } }],
  exclusions: [],
  access: [],
  boundary: null,
};

describe('transect placement', () => {
  it('lays transects at the interval with quadrats every k metres, tagged with transect and chainage', () => {
    const r = designRun(
      site,
      designSettingsDefault({ method: 'transect', baseline: [ll(0, 0), ll(1000, 0)], transectIntervalM: 200, quadratIntervalM: 50, seed: 8, minPerStratum: 0 }),
    );
    const ps = r.features.map((f) => f.properties);
    const transects = new Set(ps.map((p) => p.transect));
    expect(transects.size).toBe(5);
    // 300 m deep at 50 m steps from a random start in (0, 50]: 5 or 6 quadrats per transect.
    for (const t of transects) {
      const q = ps.filter((p) => p.transect === t).map((p) => p.chainage_m!);
      expect(q.length).toBeGreaterThanOrEqual(5);
      for (let i = 1; i < q.length; i++) expect(q[i] - q[i - 1]).toBeCloseTo(50, 1);
      for (const c of q) expect(c).toBeGreaterThan(0);
    }
    // Each quadrat lies its chainage north of the baseline (it runs east, so left is north).
    for (const p of ps) expect(p.northing - n0).toBeCloseTo(p.chainage_m! * 1.0, 0);
  });
});

import { describe, expect, it } from 'vitest';
import { localFrameAt } from '../geo/localFrame';
import { plotSafetyNotes } from './plotSafetyNotes';
import type { LonLat, Site } from '../model/types';

// An invented site near 38°S 145°E, laid out in UTM metres so distances are known by construction.
const frame = localFrameAt(145, -38);
const o = frame.toXY(145, -38);
const ll = (e: number, n: number): LonLat => frame.toLonLat(o[0] + e, o[1] + n);
const plot = (id: string, e: number, n: number) => {
  const [lon, lat] = ll(e, n);
  return { id, lon, lat };
};
const [aLon, aLat] = ll(0, 0);
const site: Site = {
  name: 'Invented test site',
  strata: [],
  parts: [],
  boundary: null,
  access: [{ id: 'A1', name: 'Test gate', kind: 'gate', lon: aLon, lat: aLat }],
  exclusions: [
    // A cliff line running north at e = 500 m.
    { id: 'C1', kind: 'cliff', bufferM: 15, name: 'Test bluff', geometry: { type: 'LineString', coordinates: [ll(500, -1000), ll(500, 1000)] } },
    // A pond from e = -300..-200, n = -50..50.
    {
      id: 'W1', kind: 'water', bufferM: 10, name: 'Test pond',
      geometry: { type: 'Polygon', coordinates: [[ll(-300, -50), ll(-200, -50), ll(-200, 50), ll(-300, 50), ll(-300, -50)]] },
    },
    // Private land north of n = 1000.
    {
      id: 'P1', kind: 'private', bufferM: 0, name: 'Test paddock',
      geometry: { type: 'Polygon', coordinates: [[ll(-1000, 1000), ll(1000, 1000), ll(1000, 2000), ll(-1000, 2000), ll(-1000, 1000)]] },
    },
  ],
};

describe('plotSafetyNotes', () => {
  it('notes a plot 40 m from a cliff edge but not one 60 m away (50 m default, common practice, no source)', () => {
    const r = plotSafetyNotes([plot('near', 460, 0), plot('far', 440, 300)], site, { frame });
    const near = r.byPlot.get('near')!.find((n) => n.code === 'near-cliff')!;
    expect(near.distanceM).toBeCloseTo(40, 6);
    expect(near.text).toMatch(/Cliff edge 40 m away \(Test bluff; noted within 50 m\)/);
    expect(r.byPlot.get('far')!.some((n) => n.code === 'near-cliff')).toBe(false);
  });

  it('notes a straight line from the access point that crosses water', () => {
    const r = plotSafetyNotes([plot('west', -400, 0), plot('south', 0, -400)], site, { frame });
    expect(r.byPlot.get('west')!.map((n) => n.code)).toContain('route-crosses-water');
    expect(r.byPlot.get('south')!.map((n) => n.code)).not.toContain('route-crosses-water');
  });

  it('notes a line that only grazes the water buffer, within its 10 m', () => {
    // The line from (0,0) to (-400, 110) passes the pond corner (-200, 50) about 5 m outside the pond.
    const r = plotSafetyNotes([plot('graze', -400, 110)], site, { frame });
    const hit = r.byPlot.get('graze')!.find((n) => n.code === 'route-crosses-water')!;
    expect(hit.distanceM).toBeGreaterThan(0);
    expect(hit.distanceM).toBeLessThan(10);
  });

  it('notes a route that passes beyond a cliff into its buffer', () => {
    const r = plotSafetyNotes([plot('over', 600, 0)], site, { frame, cliffNearM: 50 });
    expect(r.byPlot.get('over')!.map((n) => n.code)).toEqual(expect.arrayContaining(['route-crosses-cliff']));
  });

  it('notes private land within 100 m and says permission is required', () => {
    const r = plotSafetyNotes([plot('edge', 0, 930), plot('clear', 0, 880)], site, { frame });
    const n = r.byPlot.get('edge')!.find((x) => x.code === 'near-private')!;
    expect(n.distanceM).toBeCloseTo(70, 6);
    expect(n.text).toMatch(/landholder permission required before entry/);
    expect(r.byPlot.get('clear')!.some((x) => x.code === 'near-private')).toBe(false);
  });

  it('notes a plot beyond 2 km of every access point, and honours a changed threshold', () => {
    const r = plotSafetyNotes([plot('out', -2100, -100)], site, { frame });
    expect(r.byPlot.get('out')!.map((n) => n.code)).toContain('remote');
    const r2 = plotSafetyNotes([plot('out', -2100, -100)], site, { frame, remoteM: 3000 });
    expect(r2.byPlot.get('out')!.map((n) => n.code)).not.toContain('remote');
  });

  it('rejects a negative threshold and reports when no access point is mapped', () => {
    expect(() => plotSafetyNotes([], site, { cliffNearM: -1 })).toThrow(/cliffNearM must be a distance/);
    const r = plotSafetyNotes([plot('x', 0, 0)], { ...site, access: [] }, { frame });
    expect(r.warnings[0]).toMatch(/no access point/);
  });
});

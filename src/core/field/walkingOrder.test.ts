import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { geodesicDistanceM } from '../geo/bearingDistance';
import type { NavTarget } from './plotNavigation';
import { walkingOrder } from './walkingOrder';

// Metres to degrees near 38°S, only to lay out invented test points (not used for measuring).
const M_LAT = 1 / 111_000;
const M_LON = 1 / (111_000 * Math.cos((38 * Math.PI) / 180));
const start: NavTarget = { id: 'A1', lon: 145, lat: -38 };
const at = (id: string, eastM: number, northM: number): NavTarget => ({
  id,
  lon: 145 + eastM * M_LON,
  lat: -38 + northM * M_LAT,
});

describe('walkingOrder', () => {
  it('visits points on a circle in order around the circle (known optimum: the convex polygon)', () => {
    // For points in convex position the shortest closed tour is their order around the hull: an
    // optimal planar tour never crosses itself (Flood, "The traveling-salesman problem",
    // Operations Research 4 (1956) 61–75; cited from memory). 1.6 km across, the geodesic and
    // planar orders agree.
    const angles = [0, 200, 40, 320, 80, 160, 280, 120, 240];
    const pts = angles.map((a) => at(`P${a}`, 1000 + 800 * Math.cos((a * Math.PI) / 180), 800 * Math.sin((a * Math.PI) / 180)));
    const circleStart = at('A1', 1000 - 800, 0); // the start sits on the circle at 180°
    const r = walkingOrder(circleStart, pts);
    const seq = r.order.map((id) => Number(id.slice(1)));
    const ccw = [200, 240, 280, 320, 0, 40, 80, 120, 160];
    const cw = [...ccw].reverse();
    expect([ccw, cw]).toContainEqual(seq);
  });

  it('is never longer after 2-opt than the nearest-neighbour tour', () => {
    const pt = fc.record({ e: fc.integer({ min: -3000, max: 3000 }), n: fc.integer({ min: -3000, max: 3000 }) });
    fc.assert(
      fc.property(fc.array(pt, { minLength: 2, maxLength: 25 }), fc.boolean(), (xs, closed) => {
        const stops = xs.map((p, i) => at(`P${i}`, p.e, p.n));
        const r = walkingOrder(start, stops, { returnToStart: closed });
        expect(r.totalM).toBeLessThanOrEqual(r.nearestNeighbourM + 1e-6);
        expect([...r.order].sort()).toEqual(stops.map((s) => s.id).sort());
      }),
      { numRuns: 60 },
    );
  });

  it('sums its legs into the total and measures each leg geodesically', () => {
    const stops = [at('P1', 500, 0), at('P2', 500, 500), at('P3', 0, 500)];
    const r = walkingOrder(start, stops, { declinationDeg: 11.5 });
    expect(r.legs).toHaveLength(4);
    expect(r.legs.reduce((s, l) => s + l.distanceM, 0)).toBeCloseTo(r.totalM, 9);
    const first = r.legs[0];
    const from = first.fromId === 'A1' ? start : stops.find((s) => s.id === first.fromId)!;
    const to = stops.find((s) => s.id === first.toId)!;
    expect(first.distanceM).toBeCloseTo(geodesicDistanceM(from.lon, from.lat, to.lon, to.lat), 9);
    expect(first.bearingMagDeg).toBeCloseTo((first.bearingTrueDeg - 11.5 + 360) % 360, 9);
  });

  it('splits the tour into days that each fit the budget and start at the access point', () => {
    const stops = [at('P1', 1000, 0), at('P2', 2000, 0), at('P3', 3000, 0), at('P4', 3000, 1000)];
    const r = walkingOrder(start, stops, { dayBudgetM: 7000 });
    expect(r.days).toHaveLength(2);
    expect(r.days.flatMap((d) => d.plotIds)).toEqual(r.order);
    for (const d of r.days) {
      expect(d.legs[0].fromId).toBe('A1');
      expect(d.legs[d.legs.length - 1].toId).toBe('A1');
      expect(d.distanceM).toBeLessThanOrEqual(7000);
      expect(d.overBudget).toBe(false);
    }
  });

  it('flags a plot that alone is beyond the daily budget', () => {
    const r = walkingOrder(start, [at('P1', 4000, 0)], { dayBudgetM: 5000 });
    expect(r.days).toHaveLength(1);
    expect(r.days[0].overBudget).toBe(true);
  });

  it('rejects a zero budget and repeated plot ids with a clear message', () => {
    expect(() => walkingOrder(start, [at('P1', 1, 1)], { dayBudgetM: 0 })).toThrow(/positive distance/);
    expect(() => walkingOrder(start, [at('P1', 1, 1), at('P1', 2, 2)])).toThrow(/"P1" is listed twice/);
  });

  it('handles no plots at all', () => {
    const r = walkingOrder(start, []);
    expect(r).toMatchObject({ order: [], legs: [], totalM: 0 });
  });
});

import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../common/InputError';
import type { PlotToCheck } from './plotCheckTypes';
import { plotCheckRecordsBySeverity, plotsCheck } from './plotsCheck';
import type { LonLat, Site } from '../model/types';

const WGS84 = geodesic.Geodesic.WGS84;
const ORIGIN: LonLat = [147.2, -35.1]; // an invented site; no real place is described
/** The point `east` and `north` metres from the origin, by two direct geodesic steps (GeographicLib). */
function at(east: number, north: number): LonLat {
  const a = WGS84.Direct(ORIGIN[1], ORIGIN[0], 90, east);
  const b = WGS84.Direct(a.lat2!, a.lon2!, 0, north);
  return [b.lon2!, b.lat2!];
}
const square = (x0: number, y0: number, x1: number, y1: number): LonLat[] => [at(x0, y0), at(x1, y0), at(x1, y1), at(x0, y1), at(x0, y0)];

/** Stratum A (400 m square with a 100 m hole in its middle) and B beside it; a pond in B and a hazard in A. */
function site(withExclusions = true): Site {
  return {
    name: 'Invented check site',
    strata: [
      { key: 'A', label: 'Acacia flat', code: 'ACA', colour: '#336699' },
      { key: 'B', label: 'Bluebush plain', code: 'BLU', colour: '#996633' },
    ],
    parts: [
      { id: 'a', stratum: 'A', geometry: { type: 'Polygon', coordinates: [square(0, 0, 400, 400), square(150, 150, 250, 250).reverse()] } },
      { id: 'b', stratum: 'B', geometry: { type: 'Polygon', coordinates: [square(400, 0, 800, 400)] } },
    ],
    exclusions: withExclusions
      ? [
          { id: 'pond', kind: 'water', bufferM: 10, name: 'Stock pond', geometry: { type: 'Polygon', coordinates: [square(570, 170, 630, 230)] } },
          { id: 'shaft', kind: 'hazard', bufferM: 30, name: 'Old well', geometry: { type: 'Point', coordinates: at(80, 320) } },
        ]
      : [],
    access: [{ id: 'gate', name: 'West gate', kind: 'gate', lon: at(-50, 200)[0], lat: at(-50, 200)[1] }],
    boundary: null,
  };
}

const plot = (id: string, east: number, north: number, extra: Partial<PlotToCheck> = {}): PlotToCheck => {
  const [lon, lat] = at(east, north);
  return { id, where: `feature ${id}`, lon, lat, ...extra };
};
const options = { spacingM: 40, footprint: { shape: 'point' } as const, edgeBufferM: 0, surveyDate: new Date('2027-03-15T12:00:00Z') };

describe('plotsCheck', () => {
  const plots = [
    plot('HOLE', 200, 200),
    plot('POND', 600, 200),
    plot('WELL', 92, 320),
    plot('TWIN', 300, 80),
    plot('TWIN-2', 300, 80),
    plot('RES', 700, 350, { role: 'reserve', status: 'planned' }),
    plot('OK', 300, 330),
  ];
  const report = plotsCheck(site(), plots, options);
  const byId = new Map(report.plots.map((r) => [r.id, r]));
  const codes = (id: string) => byId.get(id)!.problems.map((p) => p.code);

  it('flags a plot in a hole, in a pond and near a well, and plots at one position, and passes the others', () => {
    expect(codes('HOLE')).toEqual(['in-hole']);
    expect(byId.get('HOLE')!.holeIn?.name).toBe('Acacia flat');
    expect(codes('POND')).toEqual(['excluded']);
    expect(codes('WELL')).toEqual(['excluded']);
    expect(codes('TWIN')).toEqual(['duplicate-position']);
    expect(codes('TWIN-2')).toEqual(['duplicate-position']);
    expect(codes('RES')).toEqual([]);
    expect(codes('OK')).toEqual([]);
    expect(report.counts).toEqual({ plots: 7, passing: 2, failing: 5, counted: 6 });
    expect(byId.get('POND')!.problems[0].text).toBe('Plot POND lies inside water "Stock pond", 30.0 m from its edge.');
    expect(byId.get('WELL')!.problems[0].text).toBe('Plot WELL lies 12.0 m from hazard "Old well", inside its 30 m buffer.');
    expect(byId.get('TWIN')!.problems[0].text).toBe('Plot TWIN is at the same position as plot TWIN-2 (feature TWIN-2).');
  });

  it('measures distances as GeographicLib does, to well within 0.5 m', () => {
    // Reference: geographiclib-geodesic 2.2 (Karney 2013) inverse problem between the same positions.
    const well = site().exclusions[1].geometry.coordinates as LonLat;
    const w = byId.get('WELL')!;
    expect(w.exclusions[0].distanceM).toBeCloseTo(WGS84.Inverse(w.lat, w.lon, well[1], well[0]).s12!, 1);
    const ok = byId.get('OK')!;
    const ref = WGS84.Inverse(ok.lat, ok.lon, well[1], well[0]).s12!;
    expect(Math.abs(ok.nearestByKind.hazard!.distanceM - ref)).toBeLessThan(0.5);
    const gate = site().access[0];
    const route = WGS84.Inverse(gate.lat, gate.lon, ok.lat, ok.lon);
    expect(Math.abs(ok.access!.distanceM - route.s12!)).toBeLessThan(0.5);
    expect(ok.access!.bearingTrueDeg).toBeCloseTo(route.azi1!, 6);
    // The pond's edge is 30 m from its centre (the square is 60 m across by construction), 10 m more to the east one.
    expect(Math.abs(byId.get('POND')!.exclusions[0].distanceM - 30)).toBeLessThan(0.5);
  });

  it('tests the footprint against the stratum edge, the edge buffer and the exclusion buffers', () => {
    const fp = plotsCheck(site(), [plot('EDGE', 6, 60), plot('NEAR-POND', 600, 152)], { ...options, footprint: { shape: 'square', sideM: 20, angleDeg: 0 } });
    expect(fp.plots[0].problems.map((p) => p.code)).toEqual(['stratum-edge']);
    expect(fp.plots[0].problems[0].text).toBe('The footprint of plot EDGE (square:20) crosses the boundary of stratum "Acacia flat" (ACA).');
    // 18 m south of the pond's edge: the centre is clear of its 10 m buffer, the square reaches to 8 m of the pond.
    expect(fp.plots[1].problems.map((p) => p.code)).toEqual(['excluded']);
    expect(fp.plots[1].exclusions[0].footprintM).toBeCloseTo(8, 0);
    expect(fp.plots[1].problems[0].text).toMatch(/^The footprint of plot NEAR-POND \(square:20\) comes within 8\.0 m of water "Stock pond", inside its 10 m buffer \(the plot centre is 18\.0 m away\)\.$/);
    const buffered = plotsCheck(site(), [plot('IN', 12, 60)], { ...options, edgeBufferM: 15 });
    expect(buffered.plots[0].problems[0].text).toBe('Plot IN is 12.0 m from the boundary of stratum "Acacia flat" (ACA), inside the 15 m edge buffer.');
  });

  it('compares plots per stratum with a proportional allocation on the usable area and says when a stratum has none', () => {
    const s = site(false);
    const r = plotsCheck(s, [plot('a1', 50, 50), plot('a2', 300, 300), plot('a3', 100, 350), plot('a4', 350, 50), plot('a5', 50, 200), plot('a6', 330, 200)], options);
    // Reference areas: GeographicLib polygon areas of the two strata (A less its hole); shares of 6 plots
    // by largest remainder (Cochran 1977, §5.3).
    const area = (ring: LonLat[]) => {
      const p = WGS84.Polygon(false);
      for (const [lon, lat] of ring.slice(0, -1)) p.AddPoint(lat, lon);
      return Math.abs(p.Compute(false, true).area!);
    };
    const a = area(square(0, 0, 400, 400)) - area(square(150, 150, 250, 250));
    const b = area(square(400, 0, 800, 400));
    const qa = (6 * a) / (a + b);
    const qb = (6 * b) / (a + b);
    const [na, nb] = qa - Math.floor(qa) >= qb - Math.floor(qb) ? [Math.ceil(qa), Math.floor(qb)] : [Math.floor(qa), Math.ceil(qb)];
    expect(r.strata.map((x) => [x.code, x.plots, x.proportional])).toEqual([['ACA', 6, na], ['BLU', 0, nb]]);
    expect(Math.abs(r.strata[0].usableM2 - a) / a).toBeLessThan(1e-6);
    expect(r.notes[0]).toBe('No sample plot lies in stratum "Bluebush plain" (BLU, 16.00 ha usable): inference from this set cannot cover it.');
  });

  it('says the set cannot be a probability sample when plots lie on excluded ground, and sorts by severity', () => {
    expect(report.notes.some((n) => n.startsWith('2 plots lie on excluded ground') && n.includes('POND, WELL') && n.includes('cannot be one'))).toBe(true);
    expect(report.notes).toContain('1 waiting reserve was checked but not counted as sample plots.');
    expect(plotCheckRecordsBySeverity(report.plots).map((r) => r.id)).toEqual(['POND', 'WELL', 'HOLE', 'TWIN', 'TWIN-2', 'RES', 'OK']);
  });

  it('says a plot far from the site is far away instead of measuring it in the site frame', () => {
    const r = plotsCheck(site(), [plot('OK', 300, 330), { id: 'SWAPPED', where: 'row 2', lon: -35.1, lat: 147.2 - 180 + 90 }], options);
    expect(r.plots[1].problems.map((p) => p.code)).toEqual(['outside-strata']);
    expect(r.plots[1].problems[0].text).toMatch(/^Plot SWAPPED lies outside every mapped stratum, \d+ km from the site: check its coordinates/);
    expect(r.plots[1].nearestByKind).toEqual({});
    expect(r.plots[0].nearestPlot).toBeNull();
    expect(r.plots[0].ok).toBe(true);
  });

  it('refuses bad options and an empty set with a message', () => {
    for (const bad of [() => plotsCheck(site(), [], options), () => plotsCheck(site(), plots, { ...options, spacingM: -1 }), () => plotsCheck(site(), [{ ...plots[0], lat: 95 }], options)]) {
      try {
        bad();
        expect.unreachable();
      } catch (e) {
        expect(isInputError(e)).toBe(true);
      }
    }
  });
});

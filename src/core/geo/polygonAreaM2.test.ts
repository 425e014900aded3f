import { describe, expect, it } from 'vitest';
import { localFrameAt } from './localFrame';
import { polygonAreaM2 } from './polygonAreaM2';

describe('polygonAreaM2', () => {
  it('gives GeographicLib documented area for the 1° box with geodesic edges', () => {
    // GeographicLib documentation via docs/references.md §1: 12 308 778 361.469 m².
    const area = polygonAreaM2({ type: 'Polygon', coordinates: [[[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]]] });
    expect(area).toBeCloseTo(12308778361.469, 2);
  });

  it('keeps the area when the ring is reversed', () => {
    const ring = [[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]];
    const a = polygonAreaM2({ type: 'Polygon', coordinates: [ring] });
    const b = polygonAreaM2({ type: 'Polygon', coordinates: [[...ring].reverse()] });
    expect(b).toBeCloseTo(a, 4);
  });
});

// Snyder 1987, Map Projections — A Working Manual, USGS PP 1395, eq. 3-12 (the q function) and the
// zone area (a²/2)·Δλ·|q(φ2) − q(φ1)| for a band whose edges follow parallels.
const WGS84_A = 6378137;
const WGS84_F = 1 / 298.257223563;
function snyderQ(latDeg: number, e2: number): number {
  const e = Math.sqrt(e2);
  const s = Math.sin((latDeg * Math.PI) / 180);
  return (1 - e2) * (s / (1 - e2 * s * s) - (1 / (2 * e)) * Math.log((1 - e * s) / (1 + e * s)));
}
function snyderZoneAreaM2(lat1: number, lat2: number, dLonDeg: number): number {
  const e2 = WGS84_F * (2 - WGS84_F);
  return ((WGS84_A * WGS84_A) / 2) * ((dLonDeg * Math.PI) / 180) * Math.abs(snyderQ(lat2, e2) - snyderQ(lat1, e2));
}
/** A lat/lon box whose parallel edges are densified every `stepDeg` so geodesic edges hug them. */
function densifiedBox(lon0: number, lon1: number, lat0: number, lat1: number, stepDeg = 0.001): number[][] {
  const n = Math.round((lon1 - lon0) / stepDeg);
  const ring: number[][] = [];
  for (let i = 0; i <= n; i++) ring.push([lon0 + ((lon1 - lon0) * i) / n, lat0]);
  for (let i = n; i >= 0; i--) ring.push([lon0 + ((lon1 - lon0) * i) / n, lat1]);
  ring.push([lon0, lat0]);
  return ring;
}

describe('polygonAreaM2 against published and independent values', () => {
  it('uses a q function that reproduces Snyder\'s Clarke 1866 check value', () => {
    // Snyder 1987 p. 188 numerical example via docs/references.md §1: e² = 0.00676866, φ = 40°, q = 1.2792602, q_p = 1.9954814.
    expect(snyderQ(40, 0.00676866)).toBeCloseTo(1.2792602, 7);
    expect(snyderQ(90, 0.00676866)).toBeCloseTo(1.9954814, 7);
  });

  it('gives the WGS84 total surface from the same q function', () => {
    // GeographicLib's test constant 510065621724088.5093 m² (docs/references.md §1).
    // (written to the double nearest it: 510065621724088.5)
    expect(snyderZoneAreaM2(-90, 90, 360)).toBeCloseTo(510065621724088.5, 0);
  });

  it.each([
    [0, 1],
    [45, 46],
    [60, 61],
    [-46, -45],
    [84, 85],
    [-85, -84],
  ])('matches the analytic authalic zone area for a 1° box from %f to %f', (lat0, lat1) => {
    const area = polygonAreaM2({ type: 'Polygon', coordinates: [densifiedBox(10, 11, lat0, lat1)] });
    const expected = snyderZoneAreaM2(lat0, lat1, 1);
    expect(Math.abs(area / expected - 1)).toBeLessThan(2e-9);
  });

  it.each([
    [0, 1, 12308463893.975],
    [45, 46, 8686494956.67],
    [60, 61, 6123140878.746],
  ])('matches the tabulated zone area from %f to %f', (lat0, lat1, expected) => {
    // docs/references.md §1 rows (Snyder formula, confirmed by GeographicLib Planimeter with rhumb edges).
    const area = polygonAreaM2({ type: 'Polygon', coordinates: [densifiedBox(0, 1, lat0, lat1)] });
    expect(Math.abs(area - expected)).toBeLessThan(30);
    expect(snyderZoneAreaM2(lat0, lat1, 1)).toBeCloseTo(expected, 2);
  });

  it('matches the tabulated small zone 45–45.01° × 0.01°', () => {
    // docs/references.md §1: 876 163.449 m².
    const area = polygonAreaM2({ type: 'Polygon', coordinates: [densifiedBox(0, 0.01, 45, 45.01, 0.0001)] });
    expect(area).toBeCloseTo(876163.449, 2);
  });

  it('gives the GeographicLib documented area of its Antarctica polygon', () => {
    // GeographicLib JavaScript/Python docs, "Measuring areas" example (18 vertices, lat/lon):
    // 13662703680020.1 m², perimeter 16831067.893 m (docs/references.md §1).
    const latLon = [
      [-63.1, -58], [-72.9, -74], [-71.9, -102], [-74.9, -102], [-74.3, -131], [-77.5, -163],
      [-77.4, 163], [-71.7, 172], [-65.9, 140], [-65.7, 113], [-66.6, 88], [-66.9, 59],
      [-69.8, 25], [-70.0, -4], [-71.0, -14], [-77.3, -33], [-77.9, -46], [-74.7, -61],
    ];
    const ring = latLon.map(([lat, lon]) => [lon, lat]);
    const area = polygonAreaM2({ type: 'Polygon', coordinates: [[...ring, ring[0]]] });
    expect(area).toBeCloseTo(13662703680020.1, 0);
  });

  // GeographicLib Planimeter 2.1.2 (Debian geographiclib-tools), computed 2026-12-01 with
  // `Planimeter -p 9` from the same lat/lon vertices; its areas are signed (clockwise negative).
  it.each([
    [
      'an irregular site-sized heptagon',
      [[-35.1, 150.5], [-35.103, 150.5042], [-35.1071, 150.5038], [-35.1088, 150.4991], [-35.1062, 150.4955], [-35.1049, 150.4972], [-35.1021, 150.495]],
      537098.4323,
    ],
    ['a small pentagon at 51.7°N', [[51.75, -1.26], [51.752, -1.2555], [51.7478, -1.2521], [51.7462, -1.2589], [51.7491, -1.2603]], 212961.6109],
    ['a large quadrilateral at 64°N', [[64.12, -21.9], [64.5, -20.1], [63.9, -18.7], [63.4, -20.6]], 9896159849.6278],
    ['a quadrilateral across the equator', [[0.5, 36.8], [-0.2, 37.1], [-0.6, 36.5], [0.1, 36.2]], 6646973054.2314],
  ])('agrees with GeographicLib Planimeter on %s', (_name, latLon, expected) => {
    const ring = (latLon as number[][]).map(([lat, lon]) => [lon, lat]);
    const area = polygonAreaM2({ type: 'Polygon', coordinates: [[...ring, ring[0]]] });
    expect(Math.abs(area - (expected as number))).toBeLessThan(0.001);
  });

  it('subtracts holes and adds the polygons of a multipolygon', () => {
    const outer = densifiedBox(0, 0.01, 45, 45.01, 0.0001);
    const hole = densifiedBox(0.004, 0.006, 45.004, 45.006, 0.0001).reverse();
    const holeArea = polygonAreaM2({ type: 'Polygon', coordinates: [hole] });
    const withHole = polygonAreaM2({ type: 'Polygon', coordinates: [outer, hole] });
    expect(withHole).toBeCloseTo(876163.449 - holeArea, 3);
    const other = densifiedBox(1, 1.01, 45, 45.01, 0.0001);
    const multi = polygonAreaM2({ type: 'MultiPolygon', coordinates: [[outer, hole], [other]] });
    expect(multi).toBeCloseTo(withHole + polygonAreaM2({ type: 'Polygon', coordinates: [other] }), 3);
  });

  it('keeps the area when the ring is rotated to start at any vertex', () => {
    const ring = [[150.5, -35.1], [150.5042, -35.103], [150.5038, -35.1071], [150.4991, -35.1088], [150.4955, -35.1062]];
    const base = polygonAreaM2({ type: 'Polygon', coordinates: [[...ring, ring[0]]] });
    for (let k = 1; k < ring.length; k++) {
      const r = [...ring.slice(k), ...ring.slice(0, k)];
      expect(polygonAreaM2({ type: 'Polygon', coordinates: [[...r, r[0]]] })).toBeCloseTo(base, 6);
    }
  });

  it('gives the whole when a polygon is split in two along a shared edge', () => {
    // The whole carries the split vertices too: a geodesic edge is not the parallel it spans.
    const a = [[150.5, -35.1], [150.505, -35.1], [150.51, -35.1], [150.51, -35.11], [150.503, -35.11], [150.5, -35.11], [150.5, -35.1]];
    const left = [[150.5, -35.1], [150.505, -35.1], [150.503, -35.11], [150.5, -35.11], [150.5, -35.1]];
    const right = [[150.505, -35.1], [150.51, -35.1], [150.51, -35.11], [150.503, -35.11], [150.505, -35.1]];
    const whole = polygonAreaM2({ type: 'Polygon', coordinates: [a] });
    const sum = polygonAreaM2({ type: 'Polygon', coordinates: [left] }) + polygonAreaM2({ type: 'Polygon', coordinates: [right] });
    expect(Math.abs(sum - whole)).toBeLessThan(1e-6);
  });

  it('gives the ground area of a 100 km UTM grid square from the Planimeter manual', () => {
    // GeographicLib Planimeter manual example via docs/references.md §1: zone 18N, E 500–600 km,
    // N 4400–4500 km as a geodesic polygon is 10 007 388 597.2 m² (grid area 1e10 m²).
    const frame = localFrameAt(-75, 40);
    const corners = [[500000, 4400000], [600000, 4400000], [600000, 4500000], [500000, 4500000]].map(([x, y]) => frame.toLonLat(x, y));
    expect(frame.utmZone).toBe('18N');
    expect(polygonAreaM2({ type: 'Polygon', coordinates: [[...corners, corners[0]]] })).toBeCloseTo(10007388597.2, 0);
  });
});

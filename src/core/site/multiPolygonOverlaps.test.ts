import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { multiPolygonOverlaps } from './multiPolygonOverlaps';

const box = (x: number, y: number, dx: number, dy: number) => [[x, y], [x + dx, y], [x + dx, y + dy], [x, y + dy], [x, y]];

describe('multiPolygonOverlaps', () => {
  it('names two overlapping polygons of one MultiPolygon with the overlap area on the ellipsoid', () => {
    const problems = multiPolygonOverlaps({ type: 'MultiPolygon', coordinates: [[box(150.5, -35.1, 0.004, 0.003)], [box(150.502, -35.099, 0.004, 0.003)]] }, { featureIndex: 3, layer: 'strata' });
    expect(problems).toHaveLength(1);
    expect(problems[0].message).toMatch(/^feature 3: polygons 0 and 1 of this MultiPolygon overlap by [\d.]+ m²/);
    // Reference: geographiclib-geodesic 2.2 (Karney 2013) area of the common rectangle 150.502–150.504 × −35.099 to −35.097.
    const poly = geodesic.Geodesic.WGS84.Polygon(false);
    for (const [lon, lat] of box(150.502, -35.099, 0.002, 0.002).slice(0, -1)) poly.AddPoint(lat, lon);
    expect(problems[0].areaM2).toBeCloseTo(Math.abs(poly.Compute(false, true).area ?? 0), 1);
  });

  it('finds nothing in polygons that only touch, or in a single polygon', () => {
    expect(multiPolygonOverlaps({ type: 'MultiPolygon', coordinates: [[box(150.5, -35.1, 0.004, 0.003)], [box(150.504, -35.1, 0.004, 0.003)]] }, { featureIndex: 0 })).toEqual([]);
    expect(multiPolygonOverlaps({ type: 'Polygon', coordinates: [box(150.5, -35.1, 0.004, 0.003)] }, { featureIndex: 0 })).toEqual([]);
  });
});

import geodesic from 'geographiclib-geodesic';
import { describe, expect, it } from 'vitest';
import { localFrameAt } from '../geo/localFrame';
import type { Exclusion } from '../model/types';
import { fieldHazardIndex } from './fieldHazards';

// Positions are placed with GeographicLib's direct problem (geographiclib-geodesic 2.2, Karney 2013).
const WGS84 = geodesic.Geodesic.WGS84;
const at = (lon: number, lat: number, m: number, azi: number) => {
  const r = WGS84.Direct(lat, lon, azi, m);
  return { lon: r.lon2 as number, lat: r.lat2 as number };
};

// An invented site: a shaft with a 30 m buffer and a cliff line with 15 m.
const shaft: Exclusion = { id: 'shaft', kind: 'hazard', bufferM: 30, name: 'Old shaft (invented)', notes: 'Unfenced collar.', geometry: { type: 'Point', coordinates: [119.1, -34.44] } };
const cliffStart = at(119.1, -34.44, 500, 90);
const cliffEnd = at(cliffStart.lon, cliffStart.lat, 400, 0);
const cliff: Exclusion = { id: 'cliff', kind: 'cliff', bufferM: 15, name: 'Bluff (invented)', geometry: { type: 'LineString', coordinates: [[cliffStart.lon, cliffStart.lat], [cliffEnd.lon, cliffEnd.lat]] } };
const index = fieldHazardIndex([shaft, cliff], localFrameAt(119.1, -34.44));

describe('fieldHazardIndex', () => {
  it('finds a point hazard whose buffer holds the position, and not one beyond it', () => {
    const inside = index.at(at(119.1, -34.44, 25, 45).lon, at(119.1, -34.44, 25, 45).lat);
    expect(inside.map((h) => h.exclusion.id)).toEqual(['shaft']);
    // UTM distance differs from the geodesic by the zone's scale (~0.1 % here).
    expect(inside[0].distanceM).toBeCloseTo(25, 0);
    const outside = at(119.1, -34.44, 35, 45);
    expect(index.at(outside.lon, outside.lat)).toEqual([]);
  });

  it('finds the cliff within its buffer on either side of the line', () => {
    const mid = at(cliffStart.lon, cliffStart.lat, 200, 0);
    const west = at(mid.lon, mid.lat, 10, 270);
    const east = at(mid.lon, mid.lat, 20, 90);
    expect(index.at(west.lon, west.lat).map((h) => h.exclusion.id)).toEqual(['cliff']);
    expect(index.at(east.lon, east.lat)).toEqual([]);
  });

  it('tells when the straight line to a plot crosses a buffer, though both ends are clear', () => {
    const mid = at(cliffStart.lon, cliffStart.lat, 200, 0);
    const from = at(mid.lon, mid.lat, 60, 270);
    const to = at(mid.lon, mid.lat, 60, 90);
    expect(index.at(from.lon, from.lat)).toEqual([]);
    expect(index.along(from, to).map((h) => h.exclusion.id)).toEqual(['cliff']);
    const parallel = at(from.lon, from.lat, 100, 0);
    expect(index.along(from, parallel)).toEqual([]);
  });
});

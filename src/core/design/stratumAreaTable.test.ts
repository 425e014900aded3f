import type { Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { stratumAreaTable } from './stratumAreaTable';
import type { Site } from '../model/types';

const box = (lon: number, lat: number, dLon: number, dLat: number): Polygon => ({
  type: 'Polygon',
  coordinates: [[[lon, lat], [lon + dLon, lat], [lon + dLon, lat + dLat], [lon, lat + dLat], [lon, lat]]],
});

const site: Site = {
  name: 'Invented test site',
  strata: [
    { key: 'heath', label: 'Heath', code: 'HEA', colour: '#cc6677' },
    { key: 'dune', label: 'Dune', code: 'DUN', colour: '#332288' },
  ],
  parts: [
    { id: 'a', stratum: 'heath', geometry: box(150.5, -35.1, 0.004, 0.003) },
    { id: 'b', stratum: 'heath', geometry: box(150.51, -35.1, 0.002, 0.002) },
    { id: 'c', stratum: 'dune', geometry: box(150.5, -35.095, 0.003, 0.003) },
  ],
  exclusions: [{ id: 'x', kind: 'hazard', geometry: { type: 'Point', coordinates: [150.5015, -35.0935] }, bufferM: 25 }],
  access: [],
  boundary: null,
};

describe('stratumAreaTable', () => {
  it('sums feature areas per stratum, shares to one, and names the frame', () => {
    const table = stratumAreaTable(site);
    expect(table.rows.map((r) => [r.stratum, r.features])).toEqual([['heath', 2], ['dune', 1]]);
    const heath = polygonAreaM2(site.parts[0].geometry) + polygonAreaM2(site.parts[1].geometry);
    expect(table.rows[0].area_m2).toBeCloseTo(heath, 6);
    expect(table.rows[0].area_ha).toBeCloseTo(heath / 10000, 8);
    expect(table.total_m2).toBeCloseTo(heath + table.rows[1].area_m2, 6);
    expect(table.rows[0].share + table.rows[1].share).toBeCloseTo(1, 12);
    expect(table.crs).toEqual({ utm_zone: '56S', epsg: 32756 });
  });

  it('reports usable area less the buffered exclusion only where it reaches', () => {
    const [heath, dune] = stratumAreaTable(site).rows;
    // Two heath parts go through the clipper and back through the projection: equal to ~1e-9.
    expect(Math.abs(heath.usable_m2 / heath.area_m2 - 1)).toBeLessThan(1e-9);
    // The 25 m disc lies well inside the dune box: it loses π·25² (elementary geometry) within 0.1 %.
    expect(Math.abs((dune.area_m2 - dune.usable_m2) / (Math.PI * 625) - 1)).toBeLessThan(1e-3);
  });
});

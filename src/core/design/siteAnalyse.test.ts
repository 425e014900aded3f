import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { siteValidate } from '../site/siteValidate';
import type { Site } from '../model/types';
import { siteAnalyse } from './siteAnalyse';

const site = (over: Partial<Site> = {}): Site => ({
  name: 'test',
  strata: [{ key: 'Heath', label: 'Heath', code: 'HEA', colour: '#cc6677' }],
  parts: [{ id: 'p1', stratum: 'Heath', geometry: { type: 'Polygon', coordinates: [[[150, -35], [150.01, -35], [150.01, -34.99], [150, -34.99], [150, -35]]] } }],
  exclusions: [],
  access: [],
  boundary: null,
  ...over,
});

describe('site analysis for the planner', () => {
  it('measures areas and draws a line buffer whose area is the capsule formula 2rL + πr²', () => {
    const line = { type: 'LineString' as const, coordinates: [[150.002, -34.995], [150.006, -34.995]] };
    const a = siteAnalyse(site({ exclusions: [{ id: 'c', kind: 'cliff', bufferM: 15, geometry: line }] }));
    expect(a.error).toBeNull();
    expect(a.table?.rows[0].stratum).toBe('Heath');
    expect(a.buffers.features).toHaveLength(1);
    // Elementary geometry: a segment of length L widened by r covers 2rL + πr². L is the WGS84
    // geodesic length of the line, 365.175 m (GeographicLib GeodSolve -i, Debian geographiclib-tools,
    // computed 2026-12-01). The buffer is built in UTM metres, whose scale here differs from the
    // ground by ~5e-4, hence the 0.3 % tolerance.
    const L = 365.175;
    const expected = 2 * 15 * L + Math.PI * 15 * 15;
    const measured = polygonAreaM2(a.buffers.features[0].geometry as never);
    expect(Math.abs(measured - expected) / expected).toBeLessThan(0.003);
  });

  it('reports a site with no strata polygons as nothing to measure, not an error', () => {
    const a = siteAnalyse(site({ parts: [] }));
    expect(a).toMatchObject({ table: null, error: null, problems: [] });
  });

  it('lists validation problems with where they are', () => {
    const bowtie = { type: 'Polygon' as const, coordinates: [[[150, -35], [150.01, -34.99], [150.01, -35], [150, -34.99], [150, -35]]] };
    const a = siteAnalyse(site({ parts: [{ id: 'p1', stratum: 'Heath', geometry: bowtie }] }), siteValidate);
    expect(a.problems.length).toBeGreaterThan(0);
    expect(a.problems[0].where.featureIndex).toBe(0);
  });
});

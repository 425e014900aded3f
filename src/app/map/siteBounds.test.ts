import * as turf from '@turf/turf';
import { describe, expect, it } from 'vitest';
import type { Site } from '../../core/model/types';
import { siteBounds } from './siteBounds';

// Invented site: a stratum with a hole, a two-polygon stratum, a cliff line reaching beyond them.
const site: Site = {
  name: 'bounds test (invented)',
  strata: [{ key: 'a', label: 'A', code: 'A', colour: '#777777' }],
  parts: [
    { id: 'p1', stratum: 'a', geometry: { type: 'Polygon', coordinates: [[[150, -35], [150.02, -35], [150.02, -34.98], [150, -34.98], [150, -35]], [[150.005, -34.995], [150.006, -34.995], [150.006, -34.994], [150.005, -35]]] } },
    { id: 'p2', stratum: 'a', geometry: { type: 'MultiPolygon', coordinates: [[[[150.03, -35.01], [150.04, -35.01], [150.04, -35], [150.03, -35.01]]], [[[149.99, -34.97], [149.995, -34.97], [149.995, -34.965], [149.99, -34.97]]]] } },
  ],
  exclusions: [{ id: 'c1', kind: 'cliff', bufferM: 30, geometry: { type: 'LineString', coordinates: [[150.01, -35.02], [150.05, -34.99]] } }],
  access: [{ id: 'a1', name: 'Gate', kind: 'gate', lon: 149.98, lat: -34.99 }] as Site['access'],
  boundary: null,
};

describe('siteBounds', () => {
  it('gives the box turf.bbox gives of every mapped feature and access point', () => {
    // Reference: @turf/turf bbox (7.x) over the same features.
    const all = turf.featureCollection([
      ...site.parts.map((p) => turf.feature(p.geometry)),
      ...site.exclusions.map((e) => turf.feature(e.geometry)),
      ...site.access.map((a) => turf.point([a.lon, a.lat])),
    ]);
    expect(siteBounds(site)).toEqual(turf.bbox(all));
  });

  it('is null for an empty site', () => {
    expect(siteBounds({ ...site, parts: [], exclusions: [], access: [] })).toBeNull();
  });
});

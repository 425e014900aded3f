import type { Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { repairClipOverlap } from './repairClipOverlap';
import { siteValidate } from './siteValidate';
import type { StratumPart } from '../model/types';

const X = 150.5;
const Y = -35.1;
const box = (x: number, y: number, dx: number, dy: number): Polygon => ({
  type: 'Polygon',
  coordinates: [[[x, y], [x + dx, y], [x + dx, y + dy], [x, y + dy], [x, y]]],
});
const heath: StratumPart = { id: 'h', stratum: 'Heath', geometry: box(X, Y, 0.002, 0.002) };
const dune: StratumPart = { id: 'd', stratum: 'Dune', geometry: box(X + 0.0015, Y, 0.002, 0.002) };
const site = (parts: StratumPart[]) => ({ name: 'Invented test site', strata: [], parts, exclusions: [], access: [], boundary: null });

describe('repairClipOverlap', () => {
  it('gives the overlap to the feature listed first', () => {
    const { parts, clippedM2 } = repairClipOverlap([heath, dune], { keep: 'first' });
    expect(parts[0]).toBe(heath);
    const strip = polygonAreaM2(box(X + 0.0015, Y, 0.0005, 0.002));
    expect(Math.abs(clippedM2 / strip - 1)).toBeLessThan(1e-4);
    // Parts sum to the whole: the clipped dune is its mapped area less the strip.
    expect(Math.abs(polygonAreaM2(parts[1].geometry) / (polygonAreaM2(dune.geometry) - strip) - 1)).toBeLessThan(1e-4);
    expect(siteValidate(site(parts))).toEqual([]);
  });

  it('gives the overlap to a named stratum', () => {
    const { parts } = repairClipOverlap([heath, dune], { keep: 'stratum', stratum: 'Dune' });
    expect(parts[1]).toBe(dune);
    const strip = polygonAreaM2(box(X + 0.0015, Y, 0.0005, 0.002));
    expect(Math.abs(polygonAreaM2(parts[0].geometry) / (polygonAreaM2(heath.geometry) - strip) - 1)).toBeLessThan(1e-4);
  });

  it('drops a feature that lies wholly inside the winner', () => {
    const inner: StratumPart = { id: 'i', stratum: 'Dune', geometry: box(X + 0.0005, Y + 0.0005, 0.0005, 0.0005) };
    const { parts, dropped } = repairClipOverlap([heath, inner], { keep: 'first' });
    expect(parts).toEqual([heath]);
    expect(dropped).toEqual(['i']);
  });

  it('refuses a rule naming a stratum with no features', () => {
    expect(() => repairClipOverlap([heath, dune], { keep: 'stratum', stratum: 'Marsh' })).toThrow(
      'cannot give overlaps to stratum "Marsh": it has no features',
    );
  });
});

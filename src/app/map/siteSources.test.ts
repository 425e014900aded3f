import type { Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { designRun } from '../../core/design/designRun';
import { designSettingsDefault } from '../../core/design/designSettingsDefault';
import { polygonAreaM2 } from '../../core/geo/polygonAreaM2';
import type { Site } from '../../core/model/types';
import { footprintsSource, plotsSource, strataSource } from './siteSources';
import { plotsRejectAndPromote } from '../../core/field/plotsRejectAndPromote';
import geodesic from 'geographiclib-geodesic';

const site: Site = {
  name: 'test (invented)',
  strata: [{ key: 'Heath', label: 'Heath', code: 'HEA', colour: '#cc6677' }],
  parts: [{ id: 'p1', stratum: 'Heath', geometry: { type: 'Polygon', coordinates: [[[150, -35], [150.01, -35], [150.01, -34.99], [150, -34.99], [150, -35]]] } }],
  exclusions: [],
  access: [],
  boundary: null,
};

describe('map sources built from the plan', () => {
  it('draws each square footprint with the ground area of its side squared', () => {
    const result = designRun(site, designSettingsDefault({ plots: 4, footprint: { shape: 'square', sideM: 20, angleDeg: 30 }, seed: 3 }));
    const fps = footprintsSource(result);
    expect(fps.features).toHaveLength(4);
    for (const f of fps.features) {
      // 20 m × 20 m = 400 m² on the ground (elementary geometry; measured on WGS84 by polygonAreaM2;
      // the UTM scale factor here, ~1.0005, allows 0.2 %).
      expect(Math.abs(polygonAreaM2(f.geometry as Polygon) - 400) / 400).toBeLessThan(0.002);
    }
  });

  it('puts each corner of a turned square half its diagonal from the plot, at the turned true bearing', () => {
    const result = designRun(site, designSettingsDefault({ plots: 5, footprint: { shape: 'square', sideM: 20, angleDeg: 30 }, seed: 4 }));
    const fps = footprintsSource(result);
    for (const [i, f] of fps.features.entries()) {
      const [lon, lat] = result.features[i].geometry.coordinates;
      const ring = (f.geometry as Polygon).coordinates[0];
      // Corners of a 20 m square turned 30° clockwise lie 10√2 m away at bearings 30° ± 45° + k·90°
      // (elementary geometry), measured with GeographicLib's Inverse (geographiclib-geodesic 2.x, Karney 2013).
      const bearings = [225, 135, 45, 315].map((b) => b + 30);
      for (let k = 0; k < 4; k++) {
        const g = geodesic.Geodesic.WGS84.Inverse(lat, lon, ring[k][1], ring[k][0]);
        expect(Math.abs(g.s12! - 10 * Math.SQRT2)).toBeLessThan(0.01);
        expect(Math.abs(((g.azi1! - bearings[k] + 540) % 360) - 180)).toBeLessThan(0.01);
      }
    }
  });

  it('gives plots one styling state from role and field status, and strata their colour and code', () => {
    const result = designRun(site, designSettingsDefault({ plots: 2, reservePerStratum: 1, seed: 3 }));
    const states = plotsSource(result).features.map((f) => f.properties?.state);
    expect(states.sort()).toEqual(['primary', 'primary', 'reserve']);
    expect(strataSource(site).features[0].properties).toMatchObject({ code: 'HEA', colour: '#cc6677', label: 'Heath' });
  });

  it('lists plots in drawing order, rejected under reserves under the rest, each group in design order', () => {
    const result = designRun(site, designSettingsDefault({ plots: 3, reservePerStratum: 2, seed: 3 }));
    const first = result.features.find((f) => f.properties.role === 'primary')!.properties.plot_id;
    const { collection } = plotsRejectAndPromote(result, first, 'steep ground', '2026-12-03T10:00:00Z');
    const drawn = plotsSource(collection).features.map((f) => f.properties?.state);
    expect(drawn).toEqual(['rejected', 'reserve', 'primary', 'primary', 'promoted']);
    const primaries = plotsSource(collection).features.filter((f) => f.properties?.state === 'primary').map((f) => f.properties?.plot_id);
    expect(primaries).toEqual(collection.features.filter((f) => f.properties.role === 'primary' && f.properties.plot_id !== first).map((f) => f.properties.plot_id));
  });

  it('ranks each stratum’s largest feature ahead of the others for its label, smaller strata first', () => {
    const box = (w: number, size: number): Polygon => ({ type: 'Polygon', coordinates: [[[w, -35], [w + size, -35], [w + size, -35 + size], [w, -35 + size], [w, -35]]] });
    const three: Site = {
      ...site,
      strata: [...site.strata, { key: 'Marsh', label: 'Marsh', code: 'MAR', colour: '#117733' }],
      parts: [
        { id: 'a', stratum: 'Heath', geometry: box(150, 0.01) },
        { id: 'b', stratum: 'Heath', geometry: box(150.02, 0.002) },
        { id: 'c', stratum: 'Marsh', geometry: box(150.04, 0.001) },
      ],
    };
    const rank = Object.fromEntries(strataSource(three).features.map((f) => [f.properties?.id, f.properties?.label_rank as number]));
    expect(rank.c).toBeLessThan(rank.a);
    expect(rank.a).toBeLessThan(rank.b);
  });
});

import { validateStyleMin } from '@maplibre/maplibre-gl-style-spec';
import type { FeatureCollection } from 'geojson';
import { describe, expect, it } from 'vitest';
import { graticuleLines } from '../../core/geo/graticule';
import {
  BASE_CAUTION,
  BASE_IMAGERY_BEFORE_ID,
  BASE_LAND_CREDIT,
  BASE_LAYERS,
  BASE_PALETTE,
  BASE_SOURCES,
  baseStyleBuild,
} from './baseStyle';
import { ONLINE_TILES_DEFAULT } from './onlineTiles';

const land: FeatureCollection = {
  type: 'FeatureCollection',
  features: [
    {
      type: 'Feature',
      properties: {},
      geometry: { type: 'Polygon', coordinates: [[[0, 0], [10, 0], [10, 10], [0, 10], [0, 0]]] },
    },
  ],
};
const coast: FeatureCollection = {
  type: 'FeatureCollection',
  features: [{ type: 'Feature', properties: {}, geometry: { type: 'LineString', coordinates: [[0, 0], [10, 0]] } }],
};

describe('baseStyleBuild', () => {
  it('passes the maplibre style specification validator', () => {
    // validateStyleMin from @maplibre/maplibre-gl-style-spec (the validator maplibre-gl itself runs).
    const style = baseStyleBuild({ land, coast, graticule: graticuleLines([-10, -10, 10, 10], 5) });
    expect(validateStyleMin(style)).toEqual([]);
    const online = baseStyleBuild({ land, coast, onlineTiles: { ...ONLINE_TILES_DEFAULT, enabled: true } });
    expect(validateStyleMin(online)).toEqual([]);
  });

  it('asks the network for nothing when online tiles are off: no glyphs, sprite or remote sources', () => {
    const style = baseStyleBuild({ land, coast });
    expect(style.glyphs).toBeUndefined();
    expect(style.sprite).toBeUndefined();
    expect(JSON.stringify(style)).not.toMatch(/https?:/);
  });

  it('stacks sea, land, coast, then imagery, graticule and labels', () => {
    const style = baseStyleBuild({ land, coast, onlineTiles: { ...ONLINE_TILES_DEFAULT, enabled: true } });
    expect(style.layers.map((l) => l.id)).toEqual([
      BASE_LAYERS.sea,
      BASE_LAYERS.land,
      BASE_LAYERS.coast,
      BASE_LAYERS.onlineTiles,
      BASE_LAYERS.graticule,
      BASE_LAYERS.graticuleLabels,
    ]);
    expect(BASE_IMAGERY_BEFORE_ID).toBe(BASE_LAYERS.graticule);
    expect(Object.keys(style.sources)).toContain(BASE_SOURCES.onlineTiles);
  });

  it('credits the land data and fades the coarse coast away at site scale', () => {
    const style = baseStyleBuild({ land, coast });
    expect((style.sources[BASE_SOURCES.land] as { attribution?: string }).attribution).toBe(BASE_LAND_CREDIT);
    const coastLayer = style.layers.find((l) => l.id === BASE_LAYERS.coast) as { paint: Record<string, unknown> };
    expect(coastLayer.paint['line-opacity']).toEqual(['interpolate', ['linear'], ['zoom'], 9, 1, 11, 0]);
    expect(BASE_CAUTION).toMatch(/safety plan/);
  });

  it('leaves the online tiles out while they are off', () => {
    const style = baseStyleBuild({ land, coast, onlineTiles: { ...ONLINE_TILES_DEFAULT } });
    expect(style.layers.some((l) => l.id === BASE_LAYERS.onlineTiles)).toBe(false);
    expect(style.sources[BASE_SOURCES.onlineTiles]).toBeUndefined();
  });

  it('uses a palette of its own, not the common web-map land and water colours', () => {
    // Land and water of OpenStreetMap's standard style (#f2efe9, #aad3df) and Google Maps' water
    // (#aadaff), from memory; ours keeps a clear distance from each.
    const rgb = (hex: string) => [1, 3, 5].map((k) => Number.parseInt(hex.slice(k, k + 2), 16));
    const dist = (a: string, b: string) => Math.hypot(...rgb(a).map((v, k) => v - rgb(b)[k]));
    for (const other of ['#f2efe9', '#aad3df', '#aadaff']) {
      expect(dist(BASE_PALETTE.land, other)).toBeGreaterThan(25);
      expect(dist(BASE_PALETTE.sea, other)).toBeGreaterThan(25);
    }
  });
});

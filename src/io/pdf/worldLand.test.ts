import { readFileSync } from 'node:fs';
import { booleanPointInPolygon } from '@turf/turf';
import type { Topology } from 'topojson-specification';
import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../../core/geo/polygonAreaM2';
import { WORLD_LAND_MAX_LAT, worldLandFromTopology, worldLandLoad } from './worldLand';

const topology = (scale: string): Topology =>
  JSON.parse(readFileSync(new URL(`../../../node_modules/world-atlas/land-${scale}.json`, import.meta.url), 'utf8'));

const land50 = worldLandFromTopology(topology('50m'));
const land110 = worldLandFromTopology(topology('110m'));

function isLand(world: typeof land50, lon: number, lat: number): boolean {
  return world.land.features.some((f) => booleanPointInPolygon([lon, lat], f));
}

/*
 * Places well away from any coast, chosen from general geography (from memory; any atlas).
 * The ocean points sit where a false fill would show first: along the antimeridian, in the
 * Southern Ocean that a badly closed Antarctica floods, and in the Arctic.
 */
const OCEAN: [string, number, number][] = [
  ['central Pacific on the equator', -150, 0],
  ['South Atlantic', -20, -30],
  ['Pacific on the antimeridian south of Fiji', 180, -30],
  ['Bering Sea on the antimeridian', -179.9, 57],
  ['Southern Ocean south of Africa', 20, -55],
  ['Southern Ocean south of the Pacific', -120, -60],
  ['Arctic Ocean near the pole', 0, 84],
  ['Indian Ocean', 80, -20],
  ['Tasman Sea', 160, -38],
];
const LAND: [string, number, number][] = [
  ['Congo basin', 22, -1],
  ['central Australia', 134, -24],
  ['Siberia', 100, 62],
  ['Amazonia', -60, -5],
  ['Chukotka east of the antimeridian', -173, 66.5],
  ['Chukotka west of the antimeridian', 175, 67],
  ['Antarctica inland', 60, -80],
  ['Antarctica near the cut at 85°S', 30, -84.9],
  ['Viti Levu, Fiji', 178, -17.8],
  ['Greenland ice sheet', -40, 72],
];

describe('worldLandFromTopology', () => {
  for (const [name, world] of [
    ['50m', land50],
    ['110m', land110],
  ] as const) {
    it.each(OCEAN)(`keeps open ocean free of land at ${name}: %s`, (_, lon, lat) => {
      expect(isLand(world, lon, lat)).toBe(false);
    });
    it.each(LAND)(`finds land in a continent interior at ${name}: %s`, (_, lon, lat) => {
      expect(isLand(world, lon, lat)).toBe(true);
    });
  }

  it('keeps every vertex inside −180…180° and ±85°', () => {
    for (const world of [land50, land110]) {
      let maxAbsLon = 0;
      let maxAbsLat = 0;
      for (const f of [...world.land.features, ...world.coast.features]) {
        const rings = f.geometry.type === 'Polygon' ? f.geometry.coordinates : [f.geometry.coordinates];
        for (const ring of rings) {
          for (const [lon, lat] of ring) {
            maxAbsLon = Math.max(maxAbsLon, Math.abs(lon));
            maxAbsLat = Math.max(maxAbsLat, Math.abs(lat));
          }
        }
      }
      expect(maxAbsLon).toBeLessThanOrEqual(180);
      expect(maxAbsLat).toBeLessThanOrEqual(WORLD_LAND_MAX_LAT);
    }
  });

  it('draws no coastline segment that jumps across the map', () => {
    for (const f of land50.coast.features) {
      const c = f.geometry.coordinates;
      for (let k = 1; k < c.length; k++) expect(Math.abs(c[k][0] - c[k - 1][0])).toBeLessThan(30);
    }
  });

  it('winds shells counter-clockwise and holes clockwise (RFC 7946 §3.1.6)', () => {
    const area = (ring: number[][]) => {
      let s = 0;
      for (let k = 0; k + 1 < ring.length; k++) s += ring[k][0] * ring[k + 1][1] - ring[k + 1][0] * ring[k][1];
      return s;
    };
    for (const f of land50.land.features) {
      const [shell, ...holes] = f.geometry.coordinates;
      expect(area(shell)).toBeGreaterThan(0);
      for (const h of holes) expect(area(h)).toBeLessThan(0);
    }
  });

  it('adds up to the Earth’s land area less the cap cut south of 85°S', () => {
    // Earth's land area 148.94 million km² (CIA World Factbook, "World: Geography", from memory).
    // The cap south of 85°S is all Antarctic ice: 2πa²(…) ≈ 0.97 million km² on the authalic sphere (C).
    const expectedKm2 = 148.94e6 - 0.97e6;
    const totalKm2 = land50.land.features.reduce((s, f) => s + polygonAreaM2(f.geometry), 0) / 1e6;
    expect(Math.abs(totalKm2 - expectedKm2) / expectedKm2).toBeLessThan(0.02);
  });
});

describe('worldLandLoad', () => {
  it('loads the 1:110 million land from the packaged file', async () => {
    const world = await worldLandLoad('110m');
    expect(world.land.features.length).toBe(land110.land.features.length);
  });
});

import { describe, expect, it } from 'vitest';
import { designRun } from '../designRun';
import { designSettingsDefault } from '../designSettingsDefault';
import { localFrameAt } from '../../geo/localFrame';
import type { Site } from '../../model/types';

// Chi-square upper 0.001 critical values from standard tables (docs/references.md §7): 24 df 51.18, 23 df 49.73.
const CHI2_24_DF_0001 = 51.18;
const CHI2_23_DF_0001 = 49.73;

const frame = localFrameAt(117.9, -35.02);
const [e0, n0] = frame.toXY(117.9, -35.02);
const side = 1000;
const cell = side / 5;
const ringXY = (x0: number, y0: number, w: number) =>
  [
    [x0, y0],
    [x0 + w, y0],
    [x0 + w, y0 + w],
    [x0, y0 + w],
    [x0, y0],
  ].map(([x, y]) => frame.toLonLat(x, y));

/** An invented 1 km square stratum drawn from its UTM corners, so it is an exact square in the frame. */
function squareSite(hole: boolean): Site {
  return {
    name: 'invented square',
    strata: [{ key: 'Q', label: 'Q', code: 'QQQ', colour: '#888888' }],
    parts: [{ id: 'q', stratum: 'Q', geometry: { type: 'Polygon', coordinates: [ringXY(e0, n0, side)] } }],
    exclusions: hole ? [{ id: 'h', kind: 'water', bufferM: 0, geometry: { type: 'Polygon', coordinates: [ringXY(e0 + 2 * cell, n0 + 2 * cell, cell)] } }] : [],
    access: [],
    boundary: null,
  };
}

function cellCounts(site: Site, seeds: number, perRun: number): number[] {
  const counts = new Array<number>(25).fill(0);
  for (let seed = 1; seed <= seeds; seed++) {
    const r = designRun(site, designSettingsDefault({ plots: perRun, minPerStratum: 0, seed }));
    for (const f of r.features) {
      const i = Math.min(4, Math.floor((f.properties.easting - e0) / cell));
      const j = Math.min(4, Math.floor((f.properties.northing - n0) / cell));
      counts[j * 5 + i]++;
    }
  }
  return counts;
}

function chiSquare(counts: number[]): number {
  const total = counts.reduce((a, b) => a + b, 0);
  const expected = total / counts.length;
  return counts.reduce((a, c) => a + (c - expected) ** 2 / expected, 0);
}

describe('simple random placement', () => {
  it('spreads plots uniformly over a square stratum: 25 equal cells pass a chi-square test at 0.001', () => {
    const counts = cellCounts(squareSite(false), 20, 250);
    expect(chiSquare(counts)).toBeLessThan(CHI2_24_DF_0001);
  });

  it('stays uniform over the ground left when the centre cell is excluded, and never uses the hole', () => {
    const counts = cellCounts(squareSite(true), 20, 240);
    expect(counts[12]).toBe(0);
    const rest = counts.filter((_, i) => i !== 12);
    expect(chiSquare(rest)).toBeLessThan(CHI2_23_DF_0001);
  });
});

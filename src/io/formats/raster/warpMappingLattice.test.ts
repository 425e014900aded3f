import { describe, expect, it } from 'vitest';
import { warpMappingLattice } from './warpMappingLattice';

describe('warpMappingLattice', () => {
  it('reproduces an affine mapping exactly from a coarse lattice', () => {
    let calls = 0;
    const { map, errorPx } = warpMappingLattice(300, 200, (i, j, out, at) => {
      calls++;
      out[at] = 0.5 * i + 0.25 * j + 3;
      out[at + 1] = -0.1 * i + 0.9 * j - 7;
    });
    expect(errorPx).toBeLessThan(1e-9);
    // A 32 px lattice with its cell-centre checks: far fewer exact calls than the 60 000 pixels.
    expect(calls).toBeLessThan(200);
    const k = (123 * 300 + 77) * 2;
    expect(map[k]).toBeCloseTo(0.5 * 77 + 0.25 * 123 + 3, 4);
    expect(map[k + 1]).toBeCloseTo(-0.1 * 77 + 0.9 * 123 - 7, 4);
  });

  it('refines the lattice until a curved mapping is within 0.02 pixels everywhere', () => {
    const f = (i: number, j: number): [number, number] => [i + 0.002 * i * i, j + 20 * Math.sin(i / 15)];
    const { map, errorPx } = warpMappingLattice(256, 64, (i, j, out, at) => {
      [out[at], out[at + 1]] = f(i, j);
    });
    expect(errorPx).toBeLessThanOrEqual(0.02);
    let worst = 0;
    for (let j = 0; j < 64; j++) {
      for (let i = 0; i < 256; i++) {
        const [x, y] = f(i, j);
        worst = Math.max(worst, Math.abs(map[(j * 256 + i) * 2] - x), Math.abs(map[(j * 256 + i) * 2 + 1] - y));
      }
    }
    // Cell centres are where bilinear interpolation errs most; Float32 storage adds ~1e-5.
    expect(worst).toBeLessThan(0.03);
  });

  it('handles a single row and a single pixel', () => {
    const row = warpMappingLattice(5, 1, (i, _j, out, at) => {
      out[at] = i;
      out[at + 1] = 0;
    });
    expect(Array.from(row.map)).toEqual([0, 0, 1, 0, 2, 0, 3, 0, 4, 0]);
    const one = warpMappingLattice(1, 1, (_i, _j, out, at) => {
      out[at] = 7;
      out[at + 1] = 8;
    });
    expect(Array.from(one.map)).toEqual([7, 8]);
  });
});

import { describe, expect, it } from 'vitest';
import { rngCreate } from './rng';

describe('rngCreate', () => {
  it('repeats its sequence for the same seed and differs for the next seed', () => {
    const a = rngCreate(123);
    const b = rngCreate(123);
    const c = rngCreate(124);
    const xa = Array.from({ length: 5 }, () => a.float());
    expect(Array.from({ length: 5 }, () => b.float())).toEqual(xa);
    expect(Array.from({ length: 5 }, () => c.float())).not.toEqual(xa);
  });

  it('gives floats in [0, 1) with mean near 1/2 and integers without bias over 3 values (common practice, no source)', () => {
    const r = rngCreate(7);
    let sum = 0;
    let min = 1;
    let max = 0;
    const counts = [0, 0, 0];
    for (let i = 0; i < 30000; i++) {
      const f = r.float();
      min = Math.min(min, f);
      max = Math.max(max, f);
      sum += f;
      counts[r.int(3)]++;
    }
    expect(min).toBeGreaterThanOrEqual(0);
    expect(max).toBeLessThan(1);
    expect(Math.abs(sum / 30000 - 0.5)).toBeLessThan(0.01);
    // Chi-square with 2 df, upper 0.001 critical value 13.82 (standard tables, from memory).
    const chi = counts.reduce((a, c) => a + (c - 10000) ** 2 / 10000, 0);
    expect(chi).toBeLessThan(13.82);
  });
});

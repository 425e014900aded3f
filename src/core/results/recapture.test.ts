import { describe, expect, it } from 'vitest';
import { recaptureEffectiveAreaHa, recaptureEstimate } from './recapture';

describe('recaptureEstimate', () => {
  it('matches Krebs (1989) Box 2.1', () => {
    // Krebs, Ecological Methodology, 1989, Box 2.1 (docs/references.md §4): M 948, n 421, m 167 →
    // Petersen 2390, Chapman 2382.80, SE 129.06.
    const r = recaptureEstimate({ marked: 948, caught: 421, recaptured: 167 });
    expect(Math.round(r.petersen as number)).toBe(2390);
    expect(r.chapman).toBeCloseTo(2382.8, 2);
    expect(r.se).toBeCloseTo(129.06, 2);
    expect(r.warnings).toEqual([]);
  });

  it('matches Seber (1982) Tables 3.7–3.8 (a), with the few-recaptures warning', () => {
    // Seber, The Estimation of Animal Abundance, 2nd ed. 1982, Tables 3.7–3.8 (a): 500, 149, 7 → 9393, SE 3022.
    const r = recaptureEstimate({ marked: 500, caught: 149, recaptured: 7 });
    expect(Math.round(r.chapman)).toBe(9393);
    expect(Math.round(r.se)).toBe(3022);
    expect(r.warnings).toEqual([]);
    const few = recaptureEstimate({ marked: 500, caught: 149, recaptured: 6 });
    expect(few.warnings[0]).toContain('only 6 recaptures (fewer than 7)');
  });

  it('matches Pine et al. (2013) Box 11.2', () => {
    // Pine et al. 2013, Box 11.2 (docs/references.md §4): 421, 332, 88 → Chapman 1578, SE 126.56.
    const r = recaptureEstimate({ marked: 421, caught: 332, recaptured: 88 });
    expect(Math.round(r.chapman)).toBe(1578);
    expect(r.se).toBeCloseTo(126.56, 2);
  });

  it('gives a normal CI whose lower end is never below the animals seen', () => {
    const r = recaptureEstimate({ marked: 948, caught: 421, recaptured: 167 });
    expect(r.ci95[0]).toBeCloseTo(2382.8 - 1.96 * 129.06, 0);
    const small = recaptureEstimate({ marked: 20, caught: 15, recaptured: 2 });
    expect(small.ci95[0]).toBe(33);
    expect(small.knownMinimum).toBe(33);
  });

  it('has no Petersen estimate without recaptures', () => {
    const r = recaptureEstimate({ marked: 10, caught: 10, recaptured: 0 });
    expect(r.petersen).toBeNull();
    expect(r.chapman).toBe(120);
    expect(r.warnings.join(' ')).toContain('no marked animal was recaptured');
  });

  it('gives density over the effective area and lists the assumptions', () => {
    const r = recaptureEstimate({ marked: 421, caught: 332, recaptured: 88 }, { effectiveAreaHa: 10 });
    expect(r.density?.perHa).toBeCloseTo(r.chapman / 10, 12);
    expect(r.density?.sePerHa).toBeCloseTo(r.se / 10, 12);
    expect(r.assumptions.join(' ')).toContain('closed');
  });

  it('refuses impossible counts with a clear message', () => {
    expect(() => recaptureEstimate({ marked: 10, caught: 5, recaptured: 6 })).toThrow('recaptured (6) cannot exceed caught (5)');
    expect(() => recaptureEstimate({ marked: 3, caught: 5, recaptured: 4 })).toThrow('recaptured (4) cannot exceed marked (3)');
    expect(() => recaptureEstimate({ marked: 2.5, caught: 5, recaptured: 1 })).toThrow('marked must be a whole number ≥ 0, got 2.5');
    expect(() => recaptureEstimate({ marked: 0, caught: 5, recaptured: 0 })).toThrow('marked must be at least 1');
  });
});

describe('recaptureEffectiveAreaHa', () => {
  it('adds a strip with rounded corners to a station grid', () => {
    // 10 × 10 stations 10 m apart span 90 m × 90 m; W = 20 m: 8100 + 2·20·180 + π·400 m² (by hand).
    expect(recaptureEffectiveAreaHa({ spacingM: 10, rows: 10, cols: 10 }, 20)).toBeCloseTo((8100 + 7200 + Math.PI * 400) / 1e4, 12);
  });

  it('treats a grid given by area as a square', () => {
    // 1 ha = 100 m × 100 m; W = 10 m: 10000 + 4000 + 100π m².
    expect(recaptureEffectiveAreaHa({ areaHa: 1 }, 10)).toBeCloseTo((14000 + 100 * Math.PI) / 1e4, 12);
  });

  it('refuses bad grids and strips', () => {
    expect(() => recaptureEffectiveAreaHa({ areaHa: 1 }, -1)).toThrow('strip width must be ≥ 0 m, got -1');
    expect(() => recaptureEffectiveAreaHa({ spacingM: 10, rows: 0, cols: 3 }, 5)).toThrow('rows must be a whole number ≥ 1, got 0');
    expect(() => recaptureEffectiveAreaHa({ spacingM: 10, rows: 1, cols: 1 }, 0)).toThrow('the effective area is 0');
  });
});

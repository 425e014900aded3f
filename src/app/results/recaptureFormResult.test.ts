import { describe, expect, it } from 'vitest';
import { recaptureGridBlank } from '../../state/resultsStore';
import { recaptureFormResult } from './recaptureFormResult';

const form = (patch: Partial<ReturnType<typeof recaptureGridBlank>>) => ({ ...recaptureGridBlank(1), ...patch });

describe('recaptureFormResult', () => {
  it('matches Krebs’ Box 2.1 example for Petersen, Chapman and SE', () => {
    const r = recaptureFormResult(form({ marked: '948', caught: '421', recaptured: '167' }));
    if (r.state !== 'ok') throw new Error(`expected an estimate, got ${r.state}`);
    // Krebs, Ecological Methodology, 1989, Box 2.1 (docs/references.md §4): Petersen 2390, Chapman 2382.80, SE 129.06.
    expect(r.estimate.petersen).toBeCloseTo(2389.9, 1);
    expect(r.estimate.chapman).toBeCloseTo(2382.8, 2);
    expect(r.estimate.se).toBeCloseTo(129.06, 2);
    expect(r.estimate.density).toBeNull();
  });

  it('divides by the grid plus its boundary strip for density', () => {
    const r = recaptureFormResult(form({ marked: '948', caught: '421', recaptured: '167', spacingM: '20', rows: '6', cols: '6', stripM: '10' }));
    if (r.state !== 'ok') throw new Error(`expected an estimate, got ${r.state}`);
    // By hand: L = 100 m; A = 100² + 2·10·200 + π·10² = 14 314.16 m² = 1.431416 ha.
    const areaHa = (10_000 + 4_000 + Math.PI * 100) / 10_000;
    expect(r.estimate.density?.effectiveAreaHa).toBeCloseTo(areaHa, 12);
    expect(r.estimate.density?.perHa).toBeCloseTo(r.estimate.chapman / areaHa, 9);
  });

  it('warns when fewer than 7 animals were recaptured', () => {
    const r = recaptureFormResult(form({ marked: '50', caught: '40', recaptured: '3' }));
    if (r.state !== 'ok') throw new Error(`expected an estimate, got ${r.state}`);
    expect(r.estimate.warnings[0]).toContain('fewer than 7');
  });

  it('names the grid and the field that is wrong', () => {
    expect(recaptureFormResult(form({}))).toEqual({ state: 'empty' });
    expect(recaptureFormResult(form({ marked: '12.5', caught: '4', recaptured: '1' }))).toEqual({ state: 'error', message: 'Grid 1: Marked M must be a whole number ≥ 0, got "12.5"' });
    expect(recaptureFormResult(form({ marked: '12', caught: '4', recaptured: '1', by: 'area', areaHa: '2' }))).toEqual({
      state: 'error',
      message: 'Grid 1: Strip width is needed with a grid extent (0 for no boundary strip)',
    });
    expect(recaptureFormResult(form({ marked: '12', caught: '4', recaptured: '5' }))).toEqual({ state: 'error', message: 'Grid 1: recaptured (5) cannot exceed caught (4)' });
  });
});

import { describe, expect, it } from 'vitest';
import type { PlotProperties } from '../model/designTypes';
import { plotFieldStates, plotFieldStateText, plotIsActive, plotRejectionLines, plotRejections } from './plotFieldState';

function plot(plot_id: string, role: 'primary' | 'reserve', rank: number, extra: Partial<PlotProperties> = {}): { properties: PlotProperties } {
  return {
    properties: {
      plot_id, stratum: 'Heath (invented)', role, rank, lon: 150, lat: -35, utm_zone: '56H', easting: 0, northing: 0, mgrs: '', nearest_exclusion_m: null,
      nearest_exclusion_kind: null, design_density_per_ha: 1, status: 'planned', ...extra,
    },
  };
}

// A stratum after one rejection (common practice of replacement by ranked reserves, no source).
const features = [
  plot('HEA-01', 'primary', 1, { status: 'rejected', reject_reason: 'Unsafe to reach', rejected_at: '2026-12-01T09:30:00.000Z' }),
  plot('HEA-02', 'primary', 2),
  plot('HEA-R1', 'reserve', 1, { status: 'promoted', replaces: 'HEA-01' }),
  plot('HEA-R2', 'reserve', 2),
];

describe('plotFieldStates', () => {
  it('reads primary, waiting reserve, promoted reserve replacing X, and rejected with reason, time and replacement', () => {
    const s = plotFieldStates(features.map((f) => f.properties));
    expect(s.get('HEA-01')).toEqual({ key: 'rejected', active: false, reason: 'Unsafe to reach', atIso: '2026-12-01T09:30:00.000Z', replacedBy: 'HEA-R1', standIn: 'HEA-R1', replaces: null });
    expect(s.get('HEA-02')).toEqual({ key: 'primary', active: true });
    expect(s.get('HEA-R1')).toEqual({ key: 'promoted', active: true, replaces: 'HEA-01' });
    expect(s.get('HEA-R2')).toEqual({ key: 'reserve', active: false });
    expect(features.map((f) => plotIsActive(f.properties))).toEqual([false, true, true, false]);
  });

  it('words each state for the crew', () => {
    const s = plotFieldStates(features.map((f) => f.properties));
    const text = (id: string) => plotFieldStateText(features.find((f) => f.properties.plot_id === id)!.properties, s.get(id)!);
    expect(text('HEA-01')).toEqual({ short: 'REJECTED', note: 'REJECTED 2026-12-01 09:30 UTC: Unsafe to reach. Do not visit; replaced by HEA-R1.' });
    expect(text('HEA-R1')).toEqual({ short: 'promoted, replaces HEA-01', note: 'Promoted reserve, rank 1: replaces rejected plot HEA-01. Sample it.' });
    expect(text('HEA-R2').note).toBe('Reserve, rank 2, waiting: use it only to replace a rejected plot of its stratum, in rank order.');
    expect(text('HEA-02').note).toBe('Primary plot, rank 2: sample it.');
  });

  it('lists the field decisions from the plots alone, and reads plot files that never recorded a time', () => {
    expect(plotRejections({ features } as never)).toEqual([{ plot_id: 'HEA-01', reason: 'Unsafe to reach', replacement: 'HEA-R1', at: '2026-12-01T09:30:00.000Z' }]);
    const old = [plot('HEA-01', 'primary', 1, { status: 'rejected', reject_reason: 'flooded' })];
    expect(plotRejectionLines({ features: old } as never)).toEqual(['HEA-01 rejected: flooded; no reserve left, its stratum is one plot short.']);
  });
});

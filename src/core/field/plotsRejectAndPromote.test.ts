import { describe, expect, it } from 'vitest';
import { designRun } from '../design/designRun';
import { designSettingsDefault } from '../design/designSettingsDefault';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { plotFieldStates } from './plotFieldState';
import { plotsRejectAndPromote } from './plotsRejectAndPromote';

const site = siteInventedRandom(21, 2, 1);
const design = designRun(site, designSettingsDefault({ plots: 6, reservePerStratum: 2, seed: 5 }));

describe('plotsRejectAndPromote', () => {
  it('promotes the reserves of the stratum strictly in rank order, then reports none left', () => {
    const primaries = design.features.filter((f) => f.properties.stratum === 'S0' && f.properties.role === 'primary').map((f) => f.properties.plot_id);
    const first = plotsRejectAndPromote(design, primaries[0], 'cliff edge unstable', '2026-12-01T10:00:00Z');
    expect(first.rejection).toEqual({ plot_id: primaries[0], reason: 'cliff edge unstable', replacement: 'SZR-R1', at: '2026-12-01T10:00:00Z' });
    const second = plotsRejectAndPromote(first.collection, primaries[1], 'no access', '2026-12-01T11:00:00Z');
    expect(second.rejection.replacement).toBe('SZR-R2');
    const third = plotsRejectAndPromote(second.collection, primaries[2], 'flooded', '2026-12-01T12:00:00Z');
    expect(third.rejection.replacement).toBeNull();
    expect(third.message).toMatch(/no reserve left/);
    const props = (id: string) => third.collection.features.find((f) => f.properties.plot_id === id)!.properties;
    expect(props('SZR-R1')).toMatchObject({ status: 'promoted', replaces: primaries[0] });
    expect(props(primaries[2])).toMatchObject({ status: 'rejected', reject_reason: 'flooded', rejected_at: '2026-12-01T12:00:00Z' });
  });

  it('replaces a promoted reserve that is rejected in turn with the next one, and the first plot tells who stands in now', () => {
    const primary = design.features.find((f) => f.properties.stratum === 'S0' && f.properties.role === 'primary')!.properties.plot_id;
    const first = plotsRejectAndPromote(design, primary, 'cliff edge unstable', '2026-12-01T10:00:00Z');
    const second = plotsRejectAndPromote(first.collection, 'SZR-R1', 'flooded', '2026-12-01T11:00:00Z');
    expect(second.rejection.replacement).toBe('SZR-R2');
    const states = plotFieldStates(second.collection.features.map((f) => f.properties));
    expect(states.get(primary)).toMatchObject({ key: 'rejected', replacedBy: 'SZR-R1', standIn: 'SZR-R2' });
    expect(states.get('SZR-R1')).toMatchObject({ key: 'rejected', replaces: primary, replacedBy: 'SZR-R2' });
    expect(states.get('SZR-R2')).toEqual({ key: 'promoted', active: true, replaces: 'SZR-R1' });
  });

  it('leaves the given collection unchanged and uses only reserves of the same stratum', () => {
    const before = JSON.stringify(design);
    const other = design.features.find((f) => f.properties.stratum === 'S1' && f.properties.role === 'primary')!.properties.plot_id;
    const r = plotsRejectAndPromote(design, other, 'private land', '2026-12-01T10:00:00Z');
    expect(JSON.stringify(design)).toBe(before);
    expect(r.rejection.replacement?.startsWith('S1-R')).toBe(true);
  });

  it('says clearly when the plot id is unknown or names an unused reserve', () => {
    expect(() => plotsRejectAndPromote(design, 'NOPE-01', 'x', '2026-12-01T10:00:00Z')).toThrow(/no plot "NOPE-01"/);
    expect(() => plotsRejectAndPromote(design, 'SZR-R1', 'x', '2026-12-01T10:00:00Z')).toThrow(/unused reserve/);
    expect(() => plotsRejectAndPromote(design, design.features[0].properties.plot_id, 'x', 'yesterday')).toThrow('is not a date: "yesterday"');
  });
});

import { describe, expect, it } from 'vitest';
import { designRun } from '../design/designRun';
import { designSettingsDefault } from '../design/designSettingsDefault';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { plotsRejectAndPromote } from './plotsRejectAndPromote';
import { plotsRestore } from './plotsRestore';

// Plot ids and positions come from the run itself, so the checks hold whatever the generator places.
const design = designRun(siteInventedRandom(21, 2, 1), designSettingsDefault({ plots: 6, reservePerStratum: 2, seed: 5 }));
const primaryOf = (stratum: string, k = 0) => design.features.filter((f) => f.properties.stratum === stratum && f.properties.role === 'primary')[k].properties.plot_id;

describe('plotsRestore', () => {
  it('gives back exactly the plot file of before the rejection, byte for byte', () => {
    const id = primaryOf('S0');
    const rejected = plotsRejectAndPromote(design, id, 'Unsafe to reach', '2026-12-01T09:30:00Z').collection;
    const { collection, demoted, message } = plotsRestore(rejected, id);
    expect(demoted).toBe('SZR-R1');
    expect(message).toBe(`${id} restored: visit it again; reserve SZR-R1 goes back to waiting.`);
    expect(JSON.stringify(collection)).toBe(JSON.stringify(design));
  });

  it('undoes rejections in reverse order back to the design, and a rejected promoted reserve gets its place back', () => {
    const id = primaryOf('S0');
    const a = plotsRejectAndPromote(design, id, 'Unsafe to reach', '2026-12-01T09:30:00Z').collection;
    const b = plotsRejectAndPromote(a, 'SZR-R1', 'Under water', '2026-12-01T10:30:00Z').collection;
    expect(() => plotsRestore(b, id)).toThrow(`plot ${id} was replaced by SZR-R1, which has been rejected since; restore SZR-R1 first`);
    const back = plotsRestore(b, 'SZR-R1');
    expect(back.demoted).toBe('SZR-R2');
    expect(JSON.stringify(back.collection)).toBe(JSON.stringify(a));
    expect(JSON.stringify(plotsRestore(back.collection, id).collection)).toBe(JSON.stringify(design));
  });

  it('restores a rejection that had no reserve left to promote', () => {
    const ids = [0, 1, 2].map((k) => primaryOf('S0', k));
    let c = design;
    ids.forEach((id, k) => {
      c = plotsRejectAndPromote(c, id, 'flooded', `2026-12-01T1${k}:00:00Z`).collection;
    });
    const r = plotsRestore(c, ids[2]);
    expect(r.demoted).toBeNull();
    expect(r.message).toBe(`${ids[2]} restored: visit it again.`);
  });

  it('says clearly when the plot is unknown or not rejected', () => {
    expect(() => plotsRestore(design, 'NOPE-01')).toThrow('no plot "NOPE-01" in this plot file');
    expect(() => plotsRestore(design, primaryOf('S0'))).toThrow(`plot ${primaryOf('S0')} is not rejected, so there is nothing to restore`);
  });
});

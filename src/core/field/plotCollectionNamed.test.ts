import { describe, expect, it } from 'vitest';
import { designRun } from '../design/designRun';
import { designSettingsDefault } from '../design/designSettingsDefault';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { plotCollectionById, plotCollectionNamed } from './plotCollectionNamed';
import type { Site } from '../model/types';

// An invented site whose second stratum was drawn as "Stratum 2" and renamed "Farm paddock" (FAR).
const base = siteInventedRandom(8, 2, 0);
const site: Site = {
  ...base,
  strata: [base.strata[0], { key: 'Stratum 2', label: 'Farm paddock', code: 'FAR', colour: '#332288' }],
  parts: base.parts.map((p) => (p.stratum === 'S1' ? { ...p, stratum: 'Stratum 2' } : p)),
};
const design = designRun(site, designSettingsDefault({ plots: 6, reservePerStratum: 1, seed: 2, sd: { 'Stratum 2': 4 } }));

describe('plotCollectionNamed', () => {
  it('names every plot, allocation row and setting by the current name and code, never the stable id', () => {
    const named = plotCollectionNamed(design, site.strata);
    const farm = named.features.filter((f) => f.properties.plot_id.startsWith('FAR-'));
    expect(farm.length).toBeGreaterThan(0);
    for (const f of farm) expect(f.properties).toMatchObject({ stratum: 'Farm paddock', stratum_code: 'FAR' });
    expect(Object.keys(farm[0].properties).slice(0, 3)).toEqual(['plot_id', 'stratum', 'stratum_code']);
    expect(named.design.allocation.map((r) => r.stratum)).toEqual(['S0', 'Farm paddock']);
    expect(named.design.settings.sd).toEqual({ 'Farm paddock': 4 });
    expect(JSON.stringify(named)).not.toContain('Stratum 2');
  });

  it('comes through unchanged for a plot file that already names its strata', () => {
    const named = plotCollectionNamed(design, site.strata);
    expect(plotCollectionNamed(named, site.strata)).toEqual(named);
  });

  it('keeps the stable id beside the name for the plan file and reads it back to the planner form', () => {
    const withIds = plotCollectionNamed(design, site.strata, { ids: true });
    expect(withIds.features.find((f) => f.properties.plot_id === 'FAR-01')?.properties).toMatchObject({ stratum: 'Farm paddock', stratum_code: 'FAR', stratum_id: 'Stratum 2' });
    expect(plotCollectionById(withIds)).toEqual(design);
  });

  it('puts the code and id right after the name, and after everything for a plot known only by its code', () => {
    const [first] = design.features;
    const { stratum: _s, ...noName } = first.properties;
    const byCode = { ...first, properties: { ...noName, stratum_code: 'FAR' } } as unknown as typeof first;
    const named = plotCollectionNamed({ ...design, features: [first, byCode] }, site.strata, { ids: true });
    const keys = Object.keys(first.properties);
    const at = keys.indexOf('stratum');
    expect(Object.keys(named.features[0].properties)).toEqual([...keys.slice(0, at + 1), 'stratum_code', 'stratum_id', ...keys.slice(at + 1).filter((k) => k !== 'stratum_code' && k !== 'stratum_id')]);
    const rest = Object.keys(noName).filter((k) => k !== 'stratum_code' && k !== 'stratum_id');
    expect(Object.keys(named.features[1].properties)).toEqual([...rest, 'stratum', 'stratum_code', 'stratum_id']);
    expect(named.features[1].properties).toMatchObject({ stratum: 'Farm paddock', stratum_code: 'FAR', stratum_id: 'Stratum 2' });
  });
});

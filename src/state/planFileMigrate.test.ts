import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import { plotFieldStates, plotRejections } from '../core/field/plotFieldState';
import { designOutputBytes } from '../io/plots/designOutput';
import { planFileApply, planFileFromState, planFileParse } from './planFile';
import { plannerStoreCreate } from './plannerStore';

// A plan saved by the version before plan files carried stratum ids and names apart (version 1):
// a drawn stratum "Stratum 2" renamed "Farm paddock" (FAR), one plot rejected. Invented site.
const V1_NAME = 'plan-v1-renamed-stratum-rejected-plot.stratplot.json';
const V1_TEXT = readFileSync(join(import.meta.dirname, 'fixtures', V1_NAME), 'utf8');

describe('opening a version 1 plan', () => {
  it('keeps the strata, their current names and codes, the design and the field decision', () => {
    const v1 = JSON.parse(V1_TEXT);
    expect(v1.version).toBe(1);
    const plan = planFileParse(V1_TEXT, V1_NAME);
    expect(plan.version).toBe(2);
    expect(plan.site.strata.map((s) => [s.key, s.label, s.code])).toEqual([
      ['Banksia woodland', 'Banksia woodland', 'BAW'],
      ['Stratum 2', 'Farm paddock', 'FAR'],
    ]);
    expect(plan.site.parts.map((p) => p.stratum)).toEqual(v1.site.parts.map((p: { stratum: string }) => p.stratum));
    // Version 1 plans predate recorded generator versions: they were made with the version 1 streams.
    expect(plan.design).toEqual({ ...v1.design, rngVersion: 1 });
    // The planner's plots refer to strata by id, exactly as version 1 kept them.
    expect(plan.result!.features.map((f) => f.properties.stratum)).toEqual(v1.result.features.map((f: { properties: { stratum: string } }) => f.properties.stratum));
    // The separate list is gone; its time now sits on the plot, the one record of the decision.
    expect(plan).not.toHaveProperty('rejections');
    expect(plotRejections(plan.result!)).toEqual(v1.rejections);
    const states = plotFieldStates(plan.result!.features.map((f) => f.properties));
    expect(states.get('BAW-R1')).toEqual({ key: 'promoted', active: true, replaces: 'BAW-01' });
  });

  it('saves it again as version 2, where "Stratum 2" appears only as the stratum id', () => {
    const store = plannerStoreCreate(designSettingsDefault());
    planFileApply(store, planFileParse(V1_TEXT, V1_NAME), designSettingsDefault(), true);
    const doc = planFileFromState(store.getState(), '2026-12-02T00:00:00.000Z');
    expect(doc.version).toBe(2);
    expect(doc.site.strata[1]).toEqual({ id: 'Stratum 2', name: 'Farm paddock', code: 'FAR', colour: '#332288' });
    const farm = doc.result!.features.find((f) => f.properties.plot_id === 'FAR-01')!.properties;
    expect(farm).toMatchObject({ stratum: 'Farm paddock', stratum_code: 'FAR', stratum_id: 'Stratum 2' });
    expect(doc.result!.design.allocation.map((r) => r.stratum)).toEqual(['Banksia woodland', 'Farm paddock']);
    const text = JSON.stringify(doc);
    const mentions = [...text.matchAll(/"(\w+)":"Stratum 2"/g)].map((m) => m[1]);
    expect(new Set(mentions)).toEqual(new Set(['id', 'stratum_id']));
    expect(text).not.toMatch(/"(key|label|rejections)":/);
    // And it opens again to the same plan.
    // (The planner fills settings added since, such as the budget, from the defaults.)
    const opened = planFileParse(V1_TEXT, V1_NAME);
    expect(planFileParse(text, 'again.stratplot.json')).toEqual({ ...opened, design: { ...designSettingsDefault(), ...opened.design }, savedAt: '2026-12-02T00:00:00.000Z' });
  });

  it('exports the opened plan with the current name everywhere a person reads', async () => {
    const plan = planFileParse(V1_TEXT, V1_NAME);
    for (const ext of ['csv', 'gpx', 'kml']) {
      const text = new TextDecoder().decode(await designOutputBytes(`plots.${ext}`, plan.result!, plan.site, { surveyDate: new Date('2026-12-01T12:00:00Z') }));
      expect(text, ext).toContain('Farm paddock');
      expect(text, ext).not.toContain('Stratum 2');
    }
  });
});

import { describe, expect, it } from 'vitest';
import { designRun } from '../design/designRun';
import { designSettingsDefault } from '../design/designSettingsDefault';
import { siteInventedRandom } from '../fixtures/siteInventedRandom';
import { localFrameAt } from '../geo/localFrame';
import { exportContext } from './exportContext';

// An invented site; its design recorded its UTM zone when it was made.
const site = siteInventedRandom(6, 2, 0);
const design = designRun(site, designSettingsDefault({ plots: 6, seed: 4 }));

describe('exportContext', () => {
  it('measures in the zone the design recorded, whatever the site has become since (UTM zones: NGA.SIG.0012)', () => {
    const ctx = exportContext(design, site, { annotate: false });
    expect(ctx.frame?.epsg).toBe(design.design.crs.epsg);
    // The same plots read against a site moved six degrees east keep the design's frame.
    const moved = { ...site, parts: site.parts.map((p) => ({ ...p, geometry: { ...p.geometry, coordinates: JSON.parse(JSON.stringify(p.geometry.coordinates).replace(/(-?\d+\.\d+),(-?\d+\.\d+)/g, (_m, x, y) => `${Number(x) + 6},${y}`)) } })) };
    const siteZone = localFrameAt(moved.parts[0].geometry.coordinates.flat(3)[0] as number, design.features[0].properties.lat).epsg;
    expect(siteZone).not.toBe(design.design.crs.epsg);
    expect(exportContext(design, moved, { annotate: false }).frame?.epsg).toBe(design.design.crs.epsg);
  });

  it('names, annotates once and marks the field state of every plot, and knows each code by name (common practice, no source)', () => {
    const ctx = exportContext(design, site, { surveyDate: new Date('2027-03-15T00:00:00Z') });
    expect(ctx.named.features.map((f) => f.properties.plot_id)).toEqual(design.features.map((f) => f.properties.plot_id));
    expect(ctx.field.features.every((f) => typeof f.properties.field_state === 'string')).toBe(true);
    expect([...ctx.codeOfStratum.keys()]).toEqual(site.strata.map((s) => s.label));
    // A collection already annotated is not annotated again (its notes would repeat).
    const again = exportContext(ctx.annotated, site, { surveyDate: new Date('2027-03-15T00:00:00Z') });
    expect(again.annotated.features.map((f) => f.properties.notes)).toEqual(ctx.annotated.features.map((f) => f.properties.notes));
  });
});

import { jsPDF } from 'jspdf';
import { describe, expect, it } from 'vitest';
import type { Site } from '../../core/model/types';
import { coverMapDraw } from './coverMap';
import { niceStepM } from '../../core/common/niceStepM';
import { fieldKitPlots, fieldKitSite } from '../fixtures/fieldKitSample';
import { pdfFontRegister } from './pdfFont';

const box = { x: 10, y: 10, w: 190, h: 180 };

describe('coverMapDraw', () => {
  it('points the north arrow at true north: minus the meridian convergence GeoConvert gives', () => {
    // GeographicLib GeoConvert -c on "-34.445 119.10": gamma −1.18815804271° (bearing of grid north
    // from true north), so true north lies +1.188° clockwise from grid north.
    const site: Site = {
      name: 'Invented', strata: [], parts: [], exclusions: [], boundary: null,
      access: [{ id: 'A1', name: 'Gate', kind: 'gate', lon: 119.1, lat: -34.445 }],
    };
    const doc = new jsPDF({ unit: 'mm', format: 'a4' });
    const layout = coverMapDraw(doc, box, { collection: null, site, font: pdfFontRegister(doc) });
    expect(layout.trueNorthDeg).toBeCloseTo(1.18816, 3);
    expect(layout.frame?.utmZone).toBe('50S');
  });

  it('picks a round grid step and scale bar for the invented demo site', () => {
    const site = fieldKitSite();
    const doc = new jsPDF({ unit: 'mm', format: 'a4' });
    const layout = coverMapDraw(doc, box, { collection: fieldKitPlots(site), site, font: pdfFontRegister(doc) });
    expect([100, 200, 250, 500, 1000]).toContain(layout.gridStepM);
    expect([200, 250, 500, 1000, 2000]).toContain(layout.scaleBarM);
    // The demo site is about 2.6 km across; drawn on ~185 mm it must be at about 1:15 000.
    expect(layout.metresPerMm).toBeGreaterThan(8);
    expect(layout.metresPerMm).toBeLessThan(25);
  });

  it('draws an empty frame with a message when nothing is mapped', () => {
    const doc = new jsPDF({ unit: 'mm', format: 'a4' });
    expect(coverMapDraw(doc, box, { collection: null, site: null, font: pdfFontRegister(doc) }).frame).toBeNull();
  });
});

describe('niceStepM', () => {
  it('rounds up to 1, 2, 2.5 or 5 times a power of ten', () => {
    expect(niceStepM(130)).toBe(200);
    expect(niceStepM(240)).toBe(250);
    expect(niceStepM(600)).toBe(1000);
  });
});

import { describe, expect, it } from 'vitest';
import { crewBriefing, crewBriefingText } from './crewBriefing';
import type { Site } from '../model/types';

// Invented site.
const site: Pick<Site, 'name' | 'exclusions' | 'access'> = {
  name: 'Invented Point',
  access: [{ id: 'A1', name: 'Car park', kind: 'car_park', lon: 145, lat: -38 }],
  exclusions: [
    { id: 'C1', kind: 'cliff', bufferM: 15, geometry: { type: 'Point', coordinates: [145, -38] } },
    { id: 'P1', kind: 'private', bufferM: 0, name: 'Hill paddock', notes: 'Ring the owner first (invented)', geometry: { type: 'Point', coordinates: [145, -38] } },
  ],
};

describe('crewBriefing', () => {
  it('covers cliffs, water, remote work, weather and tides and communication', () => {
    const text = crewBriefingText(crewBriefing(site));
    for (const w of [/cliff/i, /wade/i, /remote/i, /weather/i, /tide/i, /means of communication/i, /lone/i]) expect(text).toMatch(w);
  });

  it('leaves blanks for emergency contacts and check-in times', () => {
    const labels = crewBriefing(site).fields.map((f) => f.label).join('|');
    expect(labels).toMatch(/Emergency/);
    expect(labels).toMatch(/Check-in/);
  });

  it('states that local regulations, landholder agreements and the employer’s safety plan govern', () => {
    const b = crewBriefing(site);
    expect(b.governingStatement).toMatch(/does not replace local regulations, landholder agreements or your employer’s safety plan/);
    expect(crewBriefingText(b).endsWith(b.governingStatement)).toBe(true);
  });

  it('prints the thresholds in use and the mapped exclusion kinds', () => {
    const b = crewBriefing(site, { thresholds: { cliffNearM: 80 }, declinationText: '11.6° E (WMM-2025)' });
    const text = crewBriefingText(b);
    expect(text).toMatch(/within 80 m of a mapped cliff edge/);
    expect(text).toMatch(/Private land: .*permission required before entry/);
    expect(text).toMatch(/11\.6° E \(WMM-2025\)/);
    expect(text).not.toMatch(/- Water:/);
    expect(text).toMatch(/Hill paddock: Ring the owner first \(invented\)/);
  });
});

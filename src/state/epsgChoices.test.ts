import { describe, expect, it } from 'vitest';
import type { StratumPart } from '../core/model/types';
import { epsgChoices, epsgFromText, epsgName } from './epsgChoices';

const part = (lon: number, lat: number): StratumPart => ({
  id: 'p1',
  stratum: 'Heath',
  geometry: { type: 'Polygon', coordinates: [[[lon, lat], [lon + 0.01, lat], [lon + 0.01, lat + 0.01], [lon, lat + 0.01], [lon, lat]]] },
});

describe('EPSG codes offered when a file does not say its coordinate system', () => {
  it('offers WGS84 first and then the UTM zone of the site', () => {
    // Zone 50 spans 114°E–120°E; south of the equator its WGS 84 code is 32750 (EPSG dataset, epsg.org).
    const codes = epsgChoices([part(119.12, -34.44)]).map((c) => c.epsg);
    expect(codes.slice(0, 2)).toEqual([4326, 32750]);
    expect(codes).toContain(27700);
  });

  it('offers no zone before any stratum is mapped', () => {
    expect(epsgChoices([]).map((c) => c.epsg)).not.toContain(32750);
  });

  it('names the codes with the EPSG dataset names and refuses codes stratplot does not carry', () => {
    // Names as in the EPSG Geodetic Parameter Dataset (epsg.org).
    expect(epsgName(32755)).toBe('WGS 84 / UTM zone 55S');
    expect(epsgName(28356)).toBe('GDA94 / MGA zone 56');
    expect(epsgName(27700)).toBe('OSGB36 / British National Grid');
    expect(epsgName(32761)).toBeNull();
    expect(epsgFromText(' EPSG:7855 ')).toBe(7855);
    expect(epsgFromText('32761')).toBeNull();
    expect(epsgFromText('zone 55')).toBeNull();
  });
});

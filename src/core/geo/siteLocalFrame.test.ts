import type { Polygon } from 'geojson';
import { describe, expect, it } from 'vitest';
import { siteLocalFrame } from './siteLocalFrame';
import type { StratumPart } from '../model/types';

const box = (lon: number, lat: number, d: number): Polygon => ({
  type: 'Polygon',
  coordinates: [[[lon, lat], [lon + d, lat], [lon + d, lat + d], [lon, lat + d], [lon, lat]]],
});
const part = (geometry: Polygon): StratumPart => ({ id: 'p', stratum: 's', geometry });

describe('siteLocalFrame', () => {
  it('picks the UTM zone and EPSG code of the site', () => {
    // Zone 56 spans 150°E–156°E; southern zones are EPSG 327zz (NGA.SIG.0012 zone layout).
    const frame = siteLocalFrame([part(box(150.5, -35.1, 0.01))]);
    expect(frame.utmZone).toBe('56S');
    expect(frame.epsg).toBe(32756);
  });

  it('follows the area-weighted centroid, not the bounding-box centre', () => {
    // A large block in zone 56 and a tiny outlier far west in zone 55: the bbox centre lies in
    // zone 55, the area-weighted centroid in zone 56.
    const frame = siteLocalFrame([part(box(150.2, -35.1, 0.5)), part(box(146.0, -35.1, 0.001))]);
    expect(frame.utmZone).toBe('56S');
  });

  it('ignores the winding of rings and subtracts holes', () => {
    const shell = box(150.2, -35.1, 0.5).coordinates[0];
    const reversed: Polygon = { type: 'Polygon', coordinates: [[...shell].reverse()] };
    expect(siteLocalFrame([part(reversed), part(box(146.0, -35.1, 0.001))]).utmZone).toBe('56S');
  });

  it('takes a site across the antimeridian where its ground is: zone 60 or 1, not zone 31', () => {
    // Halves of one stratum split at ±180° (RFC 7946 §3.1.9), and one ring running 179.97° → −179.97°.
    expect(['60S', '1S']).toContain(siteLocalFrame([part(box(179.95, -16.5, 0.05)), part(box(-180, -16.5, 0.05))]).utmZone);
    const ring: Polygon = { type: 'Polygon', coordinates: [[[179.97, -16.5], [-179.97, -16.5], [-179.97, -16.48], [179.97, -16.48], [179.97, -16.5]]] };
    expect(['60S', '1S']).toContain(siteLocalFrame([part(ring)]).utmZone);
  });

  it('refuses a site reaching more than 1 000 km from its zone meridian, naming the reach and the limit', () => {
    expect(() => siteLocalFrame([part(box(150.2, -35.1, 0.5)), part(box(130, -35.1, 0.01))])).toThrow(
      /^the site: it is too large for one UTM frame: its strata reach [\d,]+ km from the central meridian of UTM zone \d+ .*; stratplot's limit is 1,000 km from the central meridian$/,
    );
  });

  it('refuses a site with no polygons and polar sites', () => {
    expect(() => siteLocalFrame([])).toThrow('the site has no strata polygons');
    expect(() => siteLocalFrame([part(box(10, 85, 0.1))])).toThrow(/outside UTM's 80°S–84°N/);
  });
});

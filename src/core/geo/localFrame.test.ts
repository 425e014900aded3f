import mgrs from 'mgrs';
import { describe, expect, it } from 'vitest';
import { UTM_CROSS_CHECK } from '../fixtures/utmCrossCheck';
import { localFrameAt } from './localFrame';

// WGS84 cross-check set (docs/references.md §2: proj4, a Krüger series and GeoConvert agree to 1 mm).
const CASES = UTM_CROSS_CHECK;

describe('localFrameAt', () => {
  it.each(CASES)('puts %f, %f in zone %s at the published easting and northing', (lat, lon, zone, e, n) => {
    const frame = localFrameAt(lon, lat);
    expect(frame.utmZone).toBe(zone);
    const [x, y] = frame.toXY(lon, lat);
    expect(Math.abs(x - e)).toBeLessThan(0.002);
    expect(Math.abs(y - n)).toBeLessThan(0.002);
  });

  it.each(CASES)('agrees with the independent mgrs library at %f, %f to the metre', (lat, lon) => {
    // mgrs 2.2 truncates to the metre and uses an older series (≤ 1.2 cm off at a zone edge,
    // docs/references.md §2); the cases sit ≥ 5 cm from a metre boundary, so the digits must match.
    const frame = localFrameAt(lon, lat);
    const [x, y] = frame.toXY(lon, lat);
    const ref = mgrs.forward([lon, lat], 5);
    const digits = ref.slice(-10);
    expect(Number(digits.slice(0, 5))).toBe(Math.floor(x) % 100000);
    expect(Number(digits.slice(5))).toBe(Math.floor(y) % 100000);
  });

  it('reports EPSG codes for both hemispheres', () => {
    expect(localFrameAt(151.2, -33.9).epsg).toBe(32756);
    expect(localFrameAt(-73.5, 40.5).epsg).toBe(32618);
  });

  it('returns to the same position within 1 mm after a round trip', () => {
    const frame = localFrameAt(147.3, -42.9);
    for (let i = 0; i < 50; i++) {
      const lon = 144 + i * 0.12;
      const lat = -43 + i * 0.05;
      const [x, y] = frame.toXY(lon, lat);
      const [lon2, lat2] = frame.toLonLat(x, y);
      const [x2, y2] = frame.toXY(lon2, lat2);
      expect(Math.hypot(x2 - x, y2 - y)).toBeLessThan(0.001);
    }
  });
});

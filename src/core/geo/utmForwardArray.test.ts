import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { UTM_CROSS_CHECK } from '../fixtures/utmCrossCheck';
import { localFrameAt } from './localFrame';
import { utmForwardArray } from './utmForwardArray';

// WGS84 cross-check set (docs/references.md §2: proj4, a Krüger series and GeoConvert agree to 1 mm).
const CASES = UTM_CROSS_CHECK;

describe('utmForwardArray', () => {
  it.each(CASES)('puts %f, %f (zone %s) within 1 mm of the published easting and northing', (lat, lon, _zone, e, n) => {
    const [x, y] = utmForwardArray(localFrameAt(lon, lat), [lon, lat]);
    expect(Math.abs(x - e)).toBeLessThan(0.001);
    expect(Math.abs(y - n)).toBeLessThan(0.001);
  });

  it('agrees with GeographicLib GeoConvert to 1 mm, including the invented bench site origin', () => {
    // GeoConvert manual examples (docs/references.md §2) carried to the millimetre by GeoConvert itself:
    // `GeoConvert -u -p 3` (GeographicLib 2.1.2, Debian), input "lat lon".
    const cases = [
      [33.3, 44.4, 444140.545, 3684706.356],
      [-1, 3, 500000.0, 9889469.841],
      [-34.6, 118.2, 610035.065, 6170659.579],
    ] as const;
    for (const [lat, lon, e, n] of cases) {
      const [x, y] = utmForwardArray(localFrameAt(lon, lat), [lon, lat]);
      expect(Math.abs(x - e)).toBeLessThan(0.001);
      expect(Math.abs(y - n)).toBeLessThan(0.001);
    }
  });

  it('gives exactly the coordinates of the proj4 frame for positions across a zone and beyond its edges', () => {
    // proj4 (the frame's transform, proj4js etmerc) is the reference; the same series in the same
    // order must agree to the last bit, so plots laid out through either route are identical.
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 60 }),
        fc.boolean(),
        fc.array(fc.tuple(fc.double({ min: -4, max: 4, noNaN: true }), fc.double({ min: 0, max: 84, noNaN: true })), { minLength: 1, maxLength: 200 }),
        (zone, south, offsets) => {
          const cm = 6 * zone - 183;
          const lat0 = south ? -40 : 40;
          const frame = localFrameAt(cm, lat0);
          const flat = offsets.flatMap(([dLon, lat]) => [cm + dLon, south ? -Math.min(lat, 80) : lat]);
          const out = utmForwardArray(frame, Float64Array.from(flat));
          for (let i = 0; i < flat.length; i += 2) {
            const [x, y] = frame.toXY(flat[i], flat[i + 1]);
            expect(out[i]).toBe(x);
            expect(out[i + 1]).toBe(y);
          }
        },
      ),
      { numRuns: 60 },
    );
  });

  it('writes into a given array, also in place over the input', () => {
    const frame = localFrameAt(115.9, -32);
    const data = Float64Array.from([115.9, -32, 116.1, -31.8]);
    const expected = [...frame.toXY(115.9, -32), ...frame.toXY(116.1, -31.8)];
    expect(utmForwardArray(frame, data, data)).toBe(data);
    expect([...data]).toEqual(expected);
  });

  it('refuses an output array too short for the input', () => {
    const frame = localFrameAt(115.9, -32);
    expect(() => utmForwardArray(frame, [115.9, -32, 116, -32], new Float64Array(3))).toThrow(/holds 3 values, 4 are needed/);
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../core/common/InputError';
import { crsResolveEpsg } from '../../crs/crsResolve';
import { rasterWarpToMercator } from './rasterWarpToMercator';

const utm55s = crsResolveEpsg(32755, 'test');
const grey = (w: number, h: number, v = 200) => ({ width: w, height: h, rgba: new Uint8ClampedArray(w * h * 4).fill(v) });

function inputMessage(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(isInputError(e)).toBe(true);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('rasterWarpToMercator', () => {
  it('keeps an image continuous across the antimeridian, with corners from GeoConvert', () => {
    // 20 km × 2 km in UTM 60S from E 740000, N 5302000 (invented). GeographicLib GeoConvert 2.1.2:
    // NW −42.39721583915690 179.91602380259451, NE −42.39078096518659 −179.84131900297251,
    // SE −42.40876561355463 −179.84041592746954: west is NW, east is SE, north is NE.
    const crs = crsResolveEpsg(32760, 'test');
    const img = rasterWarpToMercator(grey(200, 20), [740000, 100, 0, 5302000, 0, -100], crs);
    const [tl, tr] = img.corners;
    expect(tl[0]).toBeCloseTo(179.91602380259451, 6);
    expect(tr[0]).toBeCloseTo(-179.84041592746954 + 360, 6);
    expect(tr[0] - tl[0]).toBeLessThan(1);
    expect(tl[1]).toBeCloseTo(-42.39078096518659, 6);
  });

  it('copies source pixels unchanged with nearest sampling', () => {
    const src = grey(50, 50, 0);
    for (let k = 0; k < src.rgba.length; k += 4) {
      src.rgba[k] = 17;
      src.rgba[k + 1] = 99;
      src.rgba[k + 2] = 250;
      src.rgba[k + 3] = 255;
    }
    const img = rasterWarpToMercator(src, [500000, 1, 0, 5000000, 0, -1], utm55s, { resampling: 'nearest' });
    const seen = new Set<string>();
    for (let k = 0; k < img.rgba.length; k += 4) if (img.rgba[k + 3]) seen.add(img.rgba.slice(k, k + 4).join(','));
    expect([...seen]).toEqual(['17,99,250,255']);
  });

  it('keeps the output no larger than asked, whatever the image shape', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 400 }), fc.integer({ min: 1, max: 400 }), fc.integer({ min: 2, max: 256 }), (w, h, max) => {
        const img = rasterWarpToMercator(grey(w, h), [400000, 3, 0, 5200000, 0, -3], utm55s, { maxSizePx: max });
        expect(img.width).toBeLessThanOrEqual(max);
        expect(img.height).toBeLessThanOrEqual(max);
        expect(img.rgba.length).toBe(img.width * img.height * 4);
      }),
      { numRuns: 30 },
    );
  });

  it('refuses an image beyond Web Mercator’s latitude limit', () => {
    const wgs84 = crsResolveEpsg(4326, 'test');
    expect(inputMessage(() => rasterWarpToMercator(grey(10, 10), [0, 1, 0, 90, 0, -1], wgs84))).toMatch(
      /reaches latitude 90\.000°, beyond the map's ±85\.05° limit/,
    );
  });

  it('refuses a maximum size that is not a sensible whole number', () => {
    expect(inputMessage(() => rasterWarpToMercator(grey(4, 4), [500000, 1, 0, 5e6, 0, -1], utm55s, { maxSizePx: 1.5 }))).toMatch(
      /maximum image size 1\.5 px/,
    );
  });

  it('refuses pixels that do not match the stated size', () => {
    const bad = { width: 10, height: 10, rgba: new Uint8ClampedArray(12) };
    expect(inputMessage(() => rasterWarpToMercator(bad, [500000, 1, 0, 5e6, 0, -1], utm55s))).toMatch(/do not match/);
  });
});

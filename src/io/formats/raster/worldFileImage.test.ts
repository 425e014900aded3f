import geodesic from 'geographiclib-geodesic';
import { writeArrayBuffer } from 'geotiff';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../core/common/InputError';
import type { LonLat } from '../../../core/model/types';
import {
  MARKER_H,
  MARKER_W,
  MARKERS,
  markerPixels,
  warpedBlobCentre,
  warpedPixelLonLat,
} from '../../fixtures/warpedImageProbe';
import { geotiffImageWarp } from './geotiffImage';
import { worldFileImageWarp, worldFileParse, worldFileToGeoTransform } from './worldFileImage';

const WGS84 = geodesic.Geodesic.WGS84;
const distanceM = (a: LonLat, b: LonLat) => WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 ?? Number.NaN;

// 5 m pixels; the first pixel's CENTRE is 2.5 m inside the corner E 350000, N 5800000.
const PGW = '5.0\n0.0\n0.0\n-5.0\n350002.5\n5799997.5\n';

function messageOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    expect(isInputError(e)).toBe(true);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('worldFileParse', () => {
  it('reads the six values in the order A, D, B, E, C, F with Windows line ends', () => {
    const wf = worldFileParse('0.5\r\n0.01\r\n-0.02\r\n-0.5\r\n400000.25\r\n6000000.75\r\n\r\n');
    expect(wf).toEqual({ a: 0.5, d: 0.01, b: -0.02, e: -0.5, c: 400000.25, f: 6000000.75 });
  });

  it('turns the centre of the first pixel into the outer corner', () => {
    expect(worldFileToGeoTransform(worldFileParse(PGW))).toEqual([350000, 5, 0, 5800000, 0, -5]);
  });

  it('names the file and line of a value that is not a number', () => {
    expect(messageOf(() => worldFileParse('5\n0\n0\n-5\nabc\n5799997.5', 'site.pgw'))).toBe(
      'site.pgw, line 5: C (x of the top-left pixel centre) must be a number, found "abc"',
    );
  });

  it('explains a decimal comma', () => {
    expect(messageOf(() => worldFileParse('0,5\n0\n0\n-0,5\n1\n2', 'site.jgw'))).toMatch(/line 1: "0,5" uses a comma/);
  });

  it('counts the lines of a short file', () => {
    expect(messageOf(() => worldFileParse('5\n0\n0\n-5\n', 'site.tfw'))).toBe(
      'site.tfw: a world file has 6 lines (A, D, B, E, C, F); this one has 4',
    );
  });

  it('refuses pixels of zero size', () => {
    expect(messageOf(() => worldFileParse('0\n0\n0\n-5\n1\n2', 'a.pgw'))).toMatch(/line 1: A \(x size of a pixel\) is 0/);
    expect(messageOf(() => worldFileParse('1\n1\n1\n1\n1\n2', 'a.pgw'))).toMatch(/pixels of no area/);
  });
});

describe('worldFileImageWarp', () => {
  it('puts every marker pixel within half a source pixel of its GeoConvert position', () => {
    const img = worldFileImageWarp({ width: MARKER_W, height: MARKER_H, rgba: markerPixels(4) }, PGW, 32755);
    for (const m of MARKERS) {
      const [ci, cj] = warpedBlobCentre(img, m.lonLat, 3);
      // Half a 5 m pixel is the promise; 4 cm is what the bilinear warp gives here.
      expect(distanceM(warpedPixelLonLat(img, ci, cj), m.lonLat)).toBeLessThan(0.5);
    }
  });

  it('gives the same placement as the GeoTIFF of the same pixels', async () => {
    const png = worldFileImageWarp({ width: MARKER_W, height: MARKER_H, rgba: markerPixels(4) }, PGW, 32755);
    const tiff = await geotiffImageWarp(
      writeArrayBuffer(markerPixels(3), {
        width: MARKER_W,
        height: MARKER_H,
        BitsPerSample: [8, 8, 8],
        ModelPixelScale: [5, 5, 0],
        ModelTiepoint: [0, 0, 0, 350000, 5800000, 0],
        ProjectedCSTypeGeoKey: 32755,
        GTModelTypeGeoKey: 1,
        GTRasterTypeGeoKey: 1,
      }),
    );
    expect(png.corners).toEqual(tiff.corners);
    expect([png.width, png.height]).toEqual([tiff.width, tiff.height]);
  });

  it('georeferences a plain TIFF from its .tfw', async () => {
    const plain = writeArrayBuffer(markerPixels(3), { width: MARKER_W, height: MARKER_H, BitsPerSample: [8, 8, 8] });
    const img = await geotiffImageWarp(plain, { epsg: 32755, worldFileText: PGW });
    const m = MARKERS[2];
    const [ci, cj] = warpedBlobCentre(img, m.lonLat, 3);
    expect(distanceM(warpedPixelLonLat(img, ci, cj), m.lonLat)).toBeLessThan(0.5);
  });

  it('says when metre coordinates are paired with a degree CRS, and the reverse', () => {
    const px = { width: MARKER_W, height: MARKER_H, rgba: markerPixels(4) };
    expect(messageOf(() => worldFileImageWarp(px, PGW, 4326, { worldFileName: 'site.pgw' }))).toMatch(
      /site\.pgw: the top-left pixel 350002\.5, 5799997\.5 is not a longitude\/latitude, but EPSG:4326 is in degrees/,
    );
    const degrees = '0.00001\n0\n0\n-0.00001\n145.3\n-37.9\n';
    expect(messageOf(() => worldFileImageWarp(px, degrees, 32755, { worldFileName: 'site.pgw' }))).toMatch(
      /looks like degrees, but EPSG:32755 is in metres/,
    );
  });

  it('names an EPSG code it does not carry', () => {
    const px = { width: MARKER_W, height: MARKER_H, rgba: markerPixels(4) };
    expect(messageOf(() => worldFileImageWarp(px, PGW, 3111, { worldFileName: 'site.pgw' }))).toMatch(
      /site\.pgw: EPSG:3111 is not a coordinate system stratplot knows/,
    );
  });
});

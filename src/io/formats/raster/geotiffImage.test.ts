import { existsSync, readFileSync } from 'node:fs';
import geodesic from 'geographiclib-geodesic';
import { writeArrayBuffer } from 'geotiff';
import { describe, expect, it } from 'vitest';
import { isInputError } from '../../../core/common/InputError';
import type { LonLat } from '../../../core/model/types';
import { geotiffImageWarp } from './geotiffImage';
import {
  MARKER_H,
  MARKER_PX_M,
  MARKER_W,
  MARKERS,
  markerPixels,
  warpedBlobCentre,
  warpedPixelLonLat,
} from '../../fixtures/warpedImageProbe';

const WGS84 = geodesic.Geodesic.WGS84;

function distanceM(a: LonLat, b: LonLat): number {
  return WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 ?? Number.NaN;
}

const W = MARKER_W;
const H = MARKER_H;
const PX_M = MARKER_PX_M;
const blobCentre = warpedBlobCentre;
const outputLonLat = warpedPixelLonLat;

function markerTiff(extra: Record<string, unknown> = {}): ArrayBuffer {
  return writeArrayBuffer(markerPixels(3), {
    width: W,
    height: H,
    BitsPerSample: [8, 8, 8],
    ModelPixelScale: [PX_M, PX_M, 0],
    ModelTiepoint: [0, 0, 0, 350000, 5800000, 0],
    ProjectedCSTypeGeoKey: 32755,
    GTModelTypeGeoKey: 1,
    GTRasterTypeGeoKey: 1,
    ...extra,
  });
}

describe('geotiffImageWarp', () => {
  it('puts every marker pixel within half a source pixel of its GeoConvert position', async () => {
    const img = await geotiffImageWarp(markerTiff(), { fileName: 'markers.tif' });
    expect(img.sourceEpsg).toBe(32755);
    expect(img.sourcePixelSizeM).toBeCloseTo(5 / 0.9996 * 0.99977, 1);
    for (const m of MARKERS) {
      const [ci, cj] = blobCentre(img, m.lonLat, 3);
      const err = distanceM(outputLonLat(img, ci, cj), m.lonLat);
      expect(err, `marker at pixel ${m.col},${m.row} is ${err.toFixed(3)} m off`).toBeLessThan(PX_M / 2);
      // Bilinear resampling keeps a point's centroid: 4 cm was seen, far inside the half pixel bound.
      expect(err).toBeLessThan(0.5);
    }
    expect(img.mappingErrorPx).toBeLessThan(0.02);
  });

  it('bounds the output by the outer image corners that GeoConvert gives', async () => {
    const img = await geotiffImageWarp(markerTiff());
    // Outer corners (E 350000 / 351500, N 5800000 / 5799000) from GeographicLib GeoConvert 2.1.2:
    // NW −37.93520715835065 145.29308279365802, NE −37.93545349278534 145.31014509848507,
    // SE −37.94446255468893 145.30993874364856, SW −37.94421614086629 145.29287435773051.
    const north = -37.93520715835065;
    const east = 145.31014509848507;
    const south = -37.94446255468893;
    const west = 145.29287435773051;
    const [tl, tr, br, bl] = img.corners;
    // 1e-8° is about 1 mm: the box is the footprint's lon/lat extent, found from its sampled outline.
    expect(tl[1]).toBeCloseTo(north, 8);
    expect(br[1]).toBeCloseTo(south, 8);
    expect(tl[0]).toBeCloseTo(west, 8);
    expect(br[0]).toBeCloseTo(east, 8);
    expect(tr).toEqual([br[0], tl[1]]);
    expect(bl).toEqual([tl[0], br[1]]);
  });

  it('reads a PixelIsPoint tiepoint as the centre of the first pixel', async () => {
    // The same pixels, declared PixelIsPoint at the first pixel's centre, must land in the same place.
    const img = await geotiffImageWarp(
      markerTiff({ ModelTiepoint: [0, 0, 0, 350002.5, 5799997.5, 0], GTRasterTypeGeoKey: 2 }),
    );
    const m = MARKERS[1];
    const [ci, cj] = blobCentre(img, m.lonLat, 3);
    expect(distanceM(outputLonLat(img, ci, cj), m.lonLat)).toBeLessThan(0.5);
  });

  it('keeps the output within the maximum size and makes pixels coarser instead', async () => {
    const img = await geotiffImageWarp(markerTiff(), { maxSizePx: 64 });
    expect(Math.max(img.width, img.height)).toBeLessThanOrEqual(64);
    expect(img.pixelSizeM).toBeGreaterThan(20);
    expect(img.rgba.length).toBe(img.width * img.height * 4);
  });

  it('leaves pixels outside the rotated footprint transparent', async () => {
    const img = await geotiffImageWarp(markerTiff());
    // UTM grid north is rotated against true north here (convergence ≈ 1.05°), so the top-left
    // output pixel of the lon/lat bounding box falls outside the image.
    expect(img.rgba[3]).toBe(0);
    const centre = ((img.height >> 1) * img.width + (img.width >> 1)) * 4;
    expect(img.rgba[centre + 3]).toBe(255);
  });

  it('reads a geographic (EPSG:4326) image', async () => {
    const rgb = new Uint8Array(100 * 100 * 3).fill(90);
    const bytes = writeArrayBuffer(rgb, {
      width: 100,
      height: 100,
      BitsPerSample: [8, 8, 8],
      ModelPixelScale: [0.0001, 0.0001, 0],
      ModelTiepoint: [0, 0, 0, 147.0, -42.0, 0],
      GeographicTypeGeoKey: 4326,
      GTModelTypeGeoKey: 2,
    });
    const img = await geotiffImageWarp(bytes);
    expect(img.sourceEpsg).toBe(4326);
    expect(img.corners[0][0]).toBeCloseTo(147.0, 9);
    expect(img.corners[0][1]).toBeCloseTo(-42.0, 9);
    expect(img.corners[2][0]).toBeCloseTo(147.01, 9);
    expect(img.corners[2][1]).toBeCloseTo(-42.01, 9);
  });

  it('stretches a 16-bit grey band and makes its no-data pixels transparent', async () => {
    const w = 40;
    const h = 20;
    const values = new Uint16Array(w * h);
    for (let k = 0; k < values.length; k++) values[k] = k % w < 10 ? 0 : 1000 + (k % w) * 50;
    const bytes = writeArrayBuffer(values, {
      width: w,
      height: h,
      BitsPerSample: [16],
      GDAL_NODATA: '0',
      ModelPixelScale: [5, 5, 0],
      ModelTiepoint: [0, 0, 0, 350000, 5800000, 0],
      ProjectedCSTypeGeoKey: 32755,
      GTModelTypeGeoKey: 1,
    });
    const img = await geotiffImageWarp(bytes, { resampling: 'nearest' });
    const row = img.height >> 1;
    const at = (i: number) => img.rgba.slice((row * img.width + i) * 4, (row * img.width + i) * 4 + 4);
    // Left quarter is no-data; the rest runs dark to bright once stretched to 8 bits.
    expect(at(Math.floor(img.width * 0.1))[3]).toBe(0);
    const mid = at(Math.floor(img.width * 0.5));
    const right = at(img.width - 2);
    expect(mid[3]).toBe(255);
    expect(mid[0]).toBe(mid[1]);
    expect(right[0]).toBeGreaterThan(mid[0]);
    expect(right[0]).toBeGreaterThan(240);
  });

  it('asks for the EPSG code when the file names a coordinate system we do not carry', async () => {
    const err = await geotiffImageWarp(markerTiff({ ProjectedCSTypeGeoKey: 3111 }), { fileName: 'vicgrid.tif' }).catch(
      (e: unknown) => e,
    );
    expect(isInputError(err)).toBe(true);
    expect(String((err as Error).message)).toMatch(/vicgrid\.tif.*EPSG:3111/);
    // With a definition supplied (VicGrid GDA94, EPSG:3111 as published by epsg.org) it warps.
    const def =
      '+proj=lcc +lat_0=-37 +lon_0=145 +lat_1=-36 +lat_2=-38 +x_0=2500000 +y_0=2500000 +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs';
    const bytes = markerTiff({ ProjectedCSTypeGeoKey: 3111, ModelTiepoint: [0, 0, 0, 2500000, 2500000, 0] });
    const img = await geotiffImageWarp(bytes, { proj4Definition: def });
    expect(img.corners[0][0]).toBeCloseTo(145, 5);
    expect(img.corners[0][1]).toBeGreaterThan(-37.0001);
  });

  it('refuses bytes that are not a TIFF with a message naming the file', async () => {
    const err = await geotiffImageWarp(new Uint8Array([1, 2, 3, 4, 5, 6, 7, 8]), { fileName: 'photo.jpg' }).catch(
      (e: unknown) => e,
    );
    expect(isInputError(err)).toBe(true);
    expect((err as Error).message).toBe('photo.jpg: not a readable TIFF file');
  });

  it('refuses a TIFF without georeferencing', async () => {
    const bytes = writeArrayBuffer(new Uint8Array(16 * 16 * 3), {
      width: 16,
      height: 16,
      BitsPerSample: [8, 8, 8],
      ProjectedCSTypeGeoKey: 32755,
    });
    // The writer adds a whole-globe pixel scale but no tiepoint, which is not georeferencing.
    const err = await geotiffImageWarp(bytes, { fileName: 'plain.tif' }).catch((e: unknown) => e);
    expect(isInputError(err)).toBe(true);
    expect((err as Error).message).toMatch(/plain\.tif: the image has no georeferencing/);
  });
});

const DEMO_TIF = new URL('../../../../demo-maps/ochre-spit-aerial.tif', import.meta.url);
const DEMO_BOUNDARY = new URL('../../../../demo-maps/ochre-spit-boundary.geojson', import.meta.url);

describe.skipIf(!existsSync(DEMO_TIF) || !existsSync(DEMO_BOUNDARY))('the invented Ochre Spit demo image', () => {
  it('frames the demo boundary with the margin it was painted with', async () => {
    const img = await geotiffImageWarp(new Uint8Array(readFileSync(DEMO_TIF)), { fileName: 'ochre-spit-aerial.tif' });
    expect(Math.floor((img.sourceEpsg ?? 0) / 100)).toBe(327);
    expect(img.sourcePixelSizeM).toBeCloseTo(2.5, 1);
    const boundary = JSON.parse(readFileSync(DEMO_BOUNDARY, 'utf8'));
    const ring: LonLat[] = boundary.features[0].geometry.coordinates[0];
    const west = Math.min(...ring.map((p) => p[0]));
    const east = Math.max(...ring.map((p) => p[0]));
    const south = Math.min(...ring.map((p) => p[1]));
    const north = Math.max(...ring.map((p) => p[1]));
    const midLon = (west + east) / 2;
    const midLat = (south + north) / 2;
    const [tl, , br] = img.corners;
    // The image was painted 300 m beyond the boundary's UTM box, its origin floored to 10 m; the
    // UTM box's lon/lat extent adds a few tens of metres where grid and true north differ.
    const margins = [
      distanceM([tl[0], midLat], [west, midLat]),
      distanceM([east, midLat], [br[0], midLat]),
      distanceM([midLon, tl[1]], [midLon, north]),
      distanceM([midLon, south], [midLon, br[1]]),
    ];
    for (const m of margins) {
      expect(m).toBeGreaterThan(300);
      expect(m).toBeLessThan(360);
    }
    expect(tl[0]).toBeLessThan(west);
    expect(br[0]).toBeGreaterThan(east);
  });
});

import { execFileSync } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fromArrayBuffer } from 'geotiff';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../../core/common/InputError';
import { geotiffWrite } from './geotiffWrite';

// Reference readers: the geotiff package (geotiff.js 3.0.5), and libtiff through ImageMagick's
// `convert` where installed (Debian imagemagick 6.9); tag and key meanings from TIFF 6.0 and
// OGC GeoTIFF 1.1 (OGC 19-008r4).

function sample(width: number, height: number): Uint8Array {
  const rgb = new Uint8Array(width * height * 3);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3;
      rgb[i] = (x * 37) & 255;
      rgb[i + 1] = (y * 11) & 255;
      rgb[i + 2] = (x * y) & 255;
    }
  }
  return rgb;
}

async function readBack(bytes: Uint8Array) {
  const ab = bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
  const tiff = await fromArrayBuffer(ab);
  return tiff.getImage();
}

const place = { epsg: 32750, originX: 650_000, originY: 6_190_000, pixelSizeM: 2.5, citation: 'WGS 84 / UTM zone 50S' };

describe('geotiffWrite', () => {
  for (const compression of ['deflate', 'none'] as const) {
    it(`round-trips every pixel through an independent reader ${compression === 'none' ? 'uncompressed' : 'with Deflate compression'}`, async () => {
      const w = 37;
      const h = 150;
      const rgb = sample(w, h);
      const image = await readBack(geotiffWrite(w, h, rgb, place, { compression, rowsPerStrip: 16 }));
      expect(image.getWidth()).toBe(w);
      expect(image.getHeight()).toBe(h);
      expect(image.getSamplesPerPixel()).toBe(3);
      const data = (await image.readRasters({ interleave: true })) as unknown as Uint8Array;
      expect(Array.from(data)).toEqual(Array.from(rgb));
    });
  }

  it.skipIf(!existsSync('/usr/bin/convert'))('decodes to the same pixels in libtiff (ImageMagick convert)', () => {
    const w = 53;
    const h = 41;
    const rgb = sample(w, h);
    const dir = mkdtempSync(join(tmpdir(), 'geotiff-write-'));
    try {
      const file = join(dir, 'sample.tif');
      writeFileSync(file, geotiffWrite(w, h, rgb, place, { rowsPerStrip: 8 }));
      const decoded = execFileSync('/usr/bin/convert', [file, '-depth', '8', 'rgb:-'], { stdio: ['ignore', 'pipe', 'ignore'] });
      expect(Array.from(decoded)).toEqual(Array.from(rgb));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('names the projected CRS by EPSG code and places the image by tiepoint and pixel scale', async () => {
    const image = await readBack(geotiffWrite(40, 20, sample(40, 20), place));
    const keys = (await image.getGeoKeys()) as Record<string, unknown>;
    expect(keys.ProjectedCSTypeGeoKey).toBe(32750);
    expect(keys.GTModelTypeGeoKey).toBe(1);
    expect(keys.GTRasterTypeGeoKey).toBe(1);
    expect(keys.ProjLinearUnitsGeoKey).toBe(9001);
    expect(String(keys.GTCitationGeoKey)).toContain('UTM zone 50S');
    // 40 × 2.5 m wide, 20 × 2.5 m tall, hanging down from the top-left corner.
    expect(image.getBoundingBox()).toEqual([650_000, 6_190_000 - 50, 650_100, 6_190_000]);
    expect(image.getResolution()).toEqual([2.5, -2.5, 0]);
  });

  it('compresses a smooth image well below its raw size', () => {
    const w = 256;
    const h = 256;
    const rgb = new Uint8Array(w * h * 3).fill(120);
    expect(geotiffWrite(w, h, rgb, place).length).toBeLessThan((w * h * 3) / 20);
  });

  it('rejects a pixel buffer of the wrong length with a clear message', () => {
    expect(() => geotiffWrite(10, 10, new Uint8Array(299), place)).toThrow(InputError);
    expect(() => geotiffWrite(10, 10, new Uint8Array(299), place)).toThrow(/299 bytes .* needs 300/);
  });

  it('rejects a non-positive pixel size and a geographic EPSG code', () => {
    expect(() => geotiffWrite(2, 2, new Uint8Array(12), { ...place, pixelSizeM: 0 })).toThrow(/pixel size positive/);
    expect(() => geotiffWrite(2, 2, new Uint8Array(12), { ...place, epsg: 4326 })).toThrow(/not a projected CRS/);
  });
});

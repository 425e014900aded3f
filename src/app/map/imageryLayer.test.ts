import { validateStyleMin } from '@maplibre/maplibre-gl-style-spec';
import { describe, expect, it } from 'vitest';
import { crsResolveEpsg } from '../../io/crs/crsResolve';
import { rasterWarpToMercator } from '../../io/formats/raster/rasterWarpToMercator';
import { type CanvasDeps, imageryOpacitySet, imageryRasterLayer, imageryToImageSource, type PixelCanvas } from './imageryLayer';

// A 40 × 30 px, 10 m UTM 55S raster (invented), warped the way imported imagery is.
const warped = rasterWarpToMercator(
  { width: 40, height: 30, rgba: new Uint8ClampedArray(40 * 30 * 4).fill(128) },
  [500000, 10, 0, 5300000, 0, -10],
  crsResolveEpsg(32755, 'test'),
);

function recordingDeps() {
  const painted: { data: Uint8ClampedArray; width: number; height: number }[] = [];
  const revoked: string[] = [];
  const deps: CanvasDeps = {
    createCanvas: (width, height): PixelCanvas => ({
      width,
      height,
      getContext: () => ({ putImageData: (d: ImageData) => painted.push(d) }),
    }),
    toPngBlob: async () => new Blob([new Uint8Array([137, 80, 78, 71])], { type: 'image/png' }),
    createImageData: (data, width, height) => ({ data, width, height, colorSpace: 'srgb' }) as ImageData,
    createObjectURL: () => 'blob:test/1',
    revokeObjectURL: (url) => revoked.push(url),
  };
  return { deps, painted, revoked };
}

describe('imageryToImageSource', () => {
  it('paints the warped pixels and places them by the four corners, top-left first', async () => {
    const { deps, painted, revoked } = recordingDeps();
    const { source, revoke } = await imageryToImageSource(warped, deps);
    expect(painted).toHaveLength(1);
    expect(painted[0].width).toBe(warped.width);
    expect(painted[0].data).toBe(warped.rgba);
    expect(source.type).toBe('image');
    expect(source.url).toBe('blob:test/1');
    expect(source.coordinates).toEqual(warped.corners);
    revoke();
    expect(revoked).toEqual(['blob:test/1']);
  });

  it('makes a source and layer the maplibre style validator accepts', async () => {
    const { deps } = recordingDeps();
    const { source } = await imageryToImageSource(warped, deps);
    const style = { version: 8 as const, sources: { imagery: source }, layers: [imageryRasterLayer('imagery', 'imagery', 0.7)] };
    expect(validateStyleMin(style)).toEqual([]);
  });
});

describe('imageryOpacitySet', () => {
  it('clamps opacity to 0–1 and reports a missing layer', () => {
    const calls: [string, string, unknown][] = [];
    const map = {
      getLayer: (id: string) => (id === 'imagery' ? {} : undefined),
      setPaintProperty: (id: string, name: string, value: unknown) => calls.push([id, name, value]),
    } as unknown as Parameters<typeof imageryOpacitySet>[0];
    expect(imageryOpacitySet(map, 'imagery', 1.7)).toBe(true);
    expect(imageryOpacitySet(map, 'imagery', -1)).toBe(true);
    expect(imageryOpacitySet(map, 'imagery', Number.NaN)).toBe(true);
    expect(imageryOpacitySet(map, 'other', 0.5)).toBe(false);
    expect(calls).toEqual([
      ['imagery', 'raster-opacity', 1],
      ['imagery', 'raster-opacity', 0],
      ['imagery', 'raster-opacity', 1],
    ]);
  });
});

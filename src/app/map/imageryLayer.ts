import type { ImageSourceSpecification, Map as MapLibreMap, RasterLayerSpecification } from 'maplibre-gl';
import type { WarpedImage } from '../../io/formats/raster/rasterWarpToMercator';

/** A 2D canvas we can paint pixels into and encode: OffscreenCanvas, or an HTMLCanvasElement. */
export interface PixelCanvas {
  getContext(kind: '2d'): { putImageData(data: ImageData, x: number, y: number): void } | null;
  width: number;
  height: number;
}

/** How to get a canvas and a Blob from it; defaults use OffscreenCanvas, else document. */
export interface CanvasDeps {
  createCanvas(width: number, height: number): PixelCanvas;
  toPngBlob(canvas: PixelCanvas): Promise<Blob>;
  createImageData(rgba: Uint8ClampedArray, width: number, height: number): ImageData;
  createObjectURL(blob: Blob): string;
  revokeObjectURL(url: string): void;
}

function defaultDeps(): CanvasDeps {
  const offscreen = typeof OffscreenCanvas !== 'undefined';
  return {
    createCanvas: (w, h) => {
      if (offscreen) return new OffscreenCanvas(w, h) as unknown as PixelCanvas;
      const c = document.createElement('canvas');
      c.width = w;
      c.height = h;
      return c as unknown as PixelCanvas;
    },
    toPngBlob: (canvas) => {
      if (offscreen && canvas instanceof OffscreenCanvas) return canvas.convertToBlob({ type: 'image/png' });
      return new Promise((resolve, reject) =>
        (canvas as unknown as HTMLCanvasElement).toBlob((b) => (b ? resolve(b) : reject(new Error('the image could not be encoded'))), 'image/png'),
      );
    },
    createImageData: (rgba, w, h) => new ImageData(rgba as Uint8ClampedArray<ArrayBuffer>, w, h),
    createObjectURL: (blob) => URL.createObjectURL(blob),
    revokeObjectURL: (url) => URL.revokeObjectURL(url),
  };
}

/** A maplibre image source for warped imagery, and the call that frees its blob URL. */
export interface ImagerySource {
  source: ImageSourceSpecification;
  /** Release the blob URL once the source is removed from the map. */
  revoke(): void;
}

/**
 * Turns a warped raster into a maplibre `image` source: RGBA → canvas → PNG blob → blob URL,
 * placed by its four corners (top-left, top-right, bottom-right, bottom-left, as maplibre wants).
 * The raster is already on a Web Mercator grid, so the corner placement is exact.
 * @param image result of geotiffImageWarp or worldFileImageWarp
 * @param deps canvas and URL functions (tests pass their own)
 * @throws Error when the browser offers no 2D canvas
 */
export async function imageryToImageSource(image: WarpedImage, deps: CanvasDeps = defaultDeps()): Promise<ImagerySource> {
  const canvas = deps.createCanvas(image.width, image.height);
  const ctx = canvas.getContext('2d');
  if (!ctx) throw new Error('this browser offers no 2D canvas to show imagery');
  ctx.putImageData(deps.createImageData(image.rgba, image.width, image.height), 0, 0);
  const blob = await deps.toPngBlob(canvas);
  const url = deps.createObjectURL(blob);
  const coordinates = image.corners.map((c) => [c[0], c[1]]) as ImageSourceSpecification['coordinates'];
  return { source: { type: 'image', url, coordinates }, revoke: () => deps.revokeObjectURL(url) };
}

function clampOpacity(opacity: number): number {
  return Number.isFinite(opacity) ? Math.min(1, Math.max(0, opacity)) : 1;
}

/** The raster layer that shows an imagery source (linear magnification of the already warped pixels). */
export function imageryRasterLayer(id: string, sourceId: string, opacity = 1): RasterLayerSpecification {
  return {
    id,
    type: 'raster',
    source: sourceId,
    paint: { 'raster-opacity': clampOpacity(opacity), 'raster-fade-duration': 0, 'raster-resampling': 'linear' },
  };
}

/**
 * Sets the opacity of an imagery layer, clamped to 0–1 (a non-number gives 1).
 * @returns false when the layer is not on the map
 */
export function imageryOpacitySet(map: Pick<MapLibreMap, 'getLayer' | 'setPaintProperty'>, layerId: string, opacity: number): boolean {
  if (!map.getLayer(layerId)) return false;
  map.setPaintProperty(layerId, 'raster-opacity', clampOpacity(opacity));
  return true;
}

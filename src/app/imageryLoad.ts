import * as Comlink from 'comlink';
import type { RgbaRaster, WarpedImage } from '../io/formats/raster/rasterWarpToMercator';
import demoAerialUrl from '../../demo-maps/ochre-spit-aerial.tif?url';
import { imageryShow } from './map/imageryControl';
import { mapHandle } from './map/mapHandle';
import { plannerStore } from './plannerStoreInstance';
import { plannerWorkerStart } from './siteAnalysisRunner';
import { notify } from './usePlanner';

async function show(image: WarpedImage, label: string): Promise<void> {
  const map = mapHandle();
  if (!map) return;
  const opacity = plannerStore.getState().imagery?.opacity ?? 1;
  await imageryShow(map, image, opacity);
  plannerStore.setState({ imagery: { label, opacity, pixelSizeM: image.pixelSizeM } });
}

async function inWorker<T>(job: (api: ReturnType<typeof plannerWorkerStart>['api']) => Promise<T>): Promise<T> {
  const { api, worker } = plannerWorkerStart();
  try {
    return await job(api);
  } finally {
    worker.terminate();
  }
}

/** Shows a GeoTIFF (any CRS the importer knows, or the EPSG code given) under the map. Nothing is uploaded. */
export async function imageryLoadGeotiff(fileName: string, bytes: Uint8Array, epsg?: number): Promise<void> {
  try {
    const image = await inWorker((api) => api.imageryFromGeotiff(Comlink.transfer(bytes, [bytes.buffer as ArrayBuffer]), { fileName, epsg }));
    await show(image, fileName);
  } catch (e) {
    notify('error', (e as Error).message);
  }
}

async function decodePixels(file: File): Promise<RgbaRaster> {
  const bitmap = await createImageBitmap(file);
  const canvas = new OffscreenCanvas(bitmap.width, bitmap.height);
  const ctx = canvas.getContext('2d');
  if (!ctx) throw new Error('this browser offers no 2D canvas to read the image');
  ctx.drawImage(bitmap, 0, 0);
  const data = ctx.getImageData(0, 0, bitmap.width, bitmap.height);
  return { width: bitmap.width, height: bitmap.height, rgba: data.data };
}

/** Shows a PNG or JPEG placed by its world file (.pgw/.jgw/.wld) in the EPSG code given. */
export async function imageryLoadWorldFile(image: File, worldFile: File, epsg: number): Promise<void> {
  try {
    const pixels = await decodePixels(image);
    const text = await worldFile.text();
    const warped = await inWorker((api) => api.imageryFromWorldFile(Comlink.transfer(pixels, [pixels.rgba.buffer as ArrayBuffer]), text, epsg, worldFile.name));
    await show(warped, image.name);
  } catch (e) {
    notify('error', `${image.name}: ${(e as Error).message}`);
  }
}

/** Label of the demo site's image (synthetic, of an invented place). */
export const DEMO_IMAGE_NAME = 'ochre-spit-aerial.tif';

/** Shows the invented demo site's synthetic aerial image. */
export async function imageryLoadDemo(): Promise<void> {
  try {
    const bytes = new Uint8Array(await (await fetch(demoAerialUrl)).arrayBuffer());
    await imageryLoadGeotiff(`${DEMO_IMAGE_NAME} (synthetic image of the invented site)`, bytes);
  } catch (e) {
    notify('error', `the demo image could not be shown: ${(e as Error).message}`);
  }
}

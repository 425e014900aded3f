import type { Map as MapLibreMap } from 'maplibre-gl';
import type { WarpedImage } from '../../io/formats/raster/rasterWarpToMercator';
import { BASE_IMAGERY_BEFORE_ID } from './baseStyle';
import { imageryOpacitySet, imageryRasterLayer, imageryToImageSource } from './imageryLayer';

const SOURCE = 'sp-imagery';
const LAYER = 'sp-imagery';
let revoke: (() => void) | null = null;

/** Puts warped imagery under the site layers (replacing any earlier imagery). */
export async function imageryShow(map: MapLibreMap, image: WarpedImage, opacity: number): Promise<void> {
  const { source, revoke: free } = await imageryToImageSource(image);
  imageryRemove(map);
  map.addSource(SOURCE, source);
  const before = map.getLayer(BASE_IMAGERY_BEFORE_ID) ? BASE_IMAGERY_BEFORE_ID : 'sp-strata-fill';
  map.addLayer(imageryRasterLayer(LAYER, SOURCE, opacity), before);
  revoke = free;
}

/** Changes the imagery's opacity (0–1). */
export function imageryOpacity(map: MapLibreMap, opacity: number): void {
  imageryOpacitySet(map, LAYER, opacity);
}

/** Takes the imagery off the map and frees its pixels. */
export function imageryRemove(map: MapLibreMap): void {
  if (map.getLayer(LAYER)) map.removeLayer(LAYER);
  if (map.getSource(SOURCE)) map.removeSource(SOURCE);
  revoke?.();
  revoke = null;
}

import * as Comlink from 'comlink';
import type { DesignSettings, PlotCollection } from '../core/model/designTypes';
import { designRun } from '../core/design/designRun';
import { isInputError } from '../core/common/InputError';
import type { PlotsCheckOptions, PlotsCheckReport, PlotToCheck } from '../core/plotCheck/plotCheckTypes';
import { plotsCheck } from '../core/plotCheck/plotsCheck';
import { siteValidate } from '../core/site/siteValidate';
import { type GeotiffImageOptions, geotiffImageWarp } from '../io/formats/raster/geotiffImage';
import type { RgbaRaster } from '../io/formats/raster/rasterWarpToMercator';
import { type WorldFileCrs, worldFileImageWarp } from '../io/formats/raster/worldFileImage';
import { siteAnalyse } from '../core/design/siteAnalyse';
import { type SiteJson, type SiteSource, siteRead, siteTextReceive } from './siteSource';

export type { SiteJson, SiteSource } from './siteSource';

/** The text of the site last analysed here, kept so it can be handed to another worker (siteHandOver). */
let held: SiteJson | null = null;

/** A design's outcome as it crosses to the page: the plots, or a message for the user. */
export type DesignOutcome = { ok: true; collection: PlotCollection } | { ok: false; message: string };

/** Calls the page makes into the worker; results are structured-cloned back. */
const api = {
  analyse(siteText: SiteJson) {
    held = siteText;
    return siteAnalyse(siteRead(siteText), siteValidate);
  },
  /**
   * Posts the text of the site last analysed here on `port`, for a design or check worker. Calls
   * are answered in the order they were made, so this hands over the site of the latest `analyse`.
   */
  siteHandOver(port: MessagePort): void {
    port.postMessage(held);
  },
  /**
   * Runs designRun here, off the page's thread, reporting progress through `onProgress`. The page
   * cancels by terminating this worker, so the run needs no polling of its own.
   */
  async design(site: SiteSource, settings: DesignSettings, onProgress: (fraction: number, stage: string) => void): Promise<DesignOutcome> {
    const siteText = await siteTextReceive(site);
    let last = 0;
    try {
      const collection = designRun(siteRead(siteText), settings, {
        onProgress: (fraction, stage) => {
          const now = Date.now();
          // Progress messages are throttled: a burst of them would slow the page more than the run.
          if (now - last > 80 || fraction >= 1) {
            last = now;
            onProgress(fraction, stage);
          }
        },
      });
      return { ok: true, collection };
    } catch (e) {
      if (isInputError(e)) return { ok: false, message: (e as Error).message };
      throw e;
    }
  },
  /** Checks plots from a file against the site (plotsCheck), off the page's thread. */
  async check(site: SiteSource, plots: PlotToCheck[], options: PlotsCheckOptions): Promise<{ ok: true; report: PlotsCheckReport } | { ok: false; message: string }> {
    const siteText = await siteTextReceive(site);
    try {
      return { ok: true, report: plotsCheck(siteRead(siteText), plots, options) };
    } catch (e) {
      if (isInputError(e)) return { ok: false, message: (e as Error).message };
      throw e;
    }
  },
  /** Reads a GeoTIFF and warps it onto Web Mercator for the map (geotiffImageWarp). */
  async imageryFromGeotiff(bytes: Uint8Array, options: GeotiffImageOptions) {
    return transferred(await geotiffImageWarp(bytes, options));
  },
  /** Warps decoded PNG/JPEG pixels placed by a world file and a CRS (worldFileImageWarp). */
  imageryFromWorldFile(pixels: RgbaRaster, worldFileText: string, crs: WorldFileCrs, fileName: string) {
    return transferred(worldFileImageWarp(pixels, worldFileText, crs, { worldFileName: fileName }));
  },
};

/** Moves the warped pixels to the page instead of copying them. */
function transferred<T extends { rgba: Uint8ClampedArray }>(image: T): T {
  return Comlink.transfer(image, [image.rgba.buffer as ArrayBuffer]);
}

/** The worker's interface as the page sees it through comlink. */
export type PlannerWorkerApi = typeof api;

Comlink.expose(api);

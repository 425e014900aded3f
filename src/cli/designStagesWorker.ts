import { parentPort } from 'node:worker_threads';
import { type PartAreas, partAreasMeasurer } from '../core/design/partAreas';
import { type StratumSampling, stratumPolygons } from '../core/design/place/placementStrata';
import type { StratumOutlineXY } from '../core/design/place/stratumOutlineXY';
import { siteLocalFrame } from '../core/geo/siteLocalFrame';
import type { Exclusion, Site, StratumInfo } from '../core/model/types';
import { jobsTake } from './jobsTake';
import { stratumMade, stratumMadeBuffers } from './stratumMade';
import { type StratumPartsPacked, stratumPartsUnpack } from './stratumPartsPacked';

// The second thread of `stratplot plan` (designStagesAhead): takes stratum and part jobs from the
// shared counters, the same jobs the main thread takes, and posts back what it made.

interface StrataMessage {
  kind: 'strata';
  strata: StratumInfo[];
  parts: StratumPartsPacked;
  /** Next stratum job, next part job. */
  counters: SharedArrayBuffer;
  sampling: StratumSampling;
}

let site: Site | null = null;
let counters: Int32Array | null = null;
let frame: ReturnType<typeof siteLocalFrame> | null = null;

parentPort?.on('message', (m: StrataMessage | { kind: 'exclusions'; exclusions: Exclusion[] }) => {
  try {
    if (m.kind === 'strata') {
      const parts = stratumPartsUnpack(m.parts);
      site = { name: '', strata: m.strata, parts, exclusions: [], access: [], boundary: null };
      counters = new Int32Array(m.counters);
      frame = siteLocalFrame(parts);
      const made: { index: number; shape: StratumOutlineXY }[] = [];
      const transfer: ArrayBuffer[] = [];
      jobsTake(counters, 0, site.strata.length, (k) => {
        const shape = stratumMade(stratumPolygons(site!, site!.strata[k].key), frame!, m.sampling);
        made.push({ index: k, shape });
        transfer.push(...stratumMadeBuffers(shape));
      });
      parentPort?.postMessage({ kind: 'strata', made }, transfer);
      return;
    }
    if (!site || !counters || !frame) throw new Error('exclusions came before the strata');
    const withExclusions: Site = { ...site, exclusions: m.exclusions };
    const measure = partAreasMeasurer(withExclusions, frame);
    const made: { index: number; areas: PartAreas }[] = [];
    jobsTake(counters, 1, site.parts.length, (k) => made.push({ index: k, areas: measure(k) }));
    parentPort?.postMessage({ kind: 'parts', made });
  } catch (error) {
    // The main thread then makes every stage itself, and reports any error as it always does.
    parentPort?.postMessage({ kind: 'failed', message: error instanceof Error ? error.message : String(error) });
  }
});

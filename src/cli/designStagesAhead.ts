import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { DesignStagesMade } from '../core/design/designRun';
import { placementPolygonOver } from '../core/design/designSizeCheck';
import { type PartAreas, partAreasMeasurer } from '../core/design/partAreas';
import { type StratumSampling, stratumPolygons } from '../core/design/place/placementStrata';
import type { StratumOutlineXY } from '../core/design/place/stratumOutlineXY';
import { stratumMade } from './stratumMade';
import { siteLocalFrame } from '../core/geo/siteLocalFrame';
import type { Exclusion, Site, StratumInfo, StratumPart } from '../core/model/types';
import { jobsTake } from './jobsTake';
import { stratumPartsPack } from './stratumPartsPacked';

/** The stages of a design that a second thread helps make while the main thread reads and checks the map. */
export interface DesignStagesAhead {
  /** Hands over the strata as soon as they are read, before they are checked. */
  strataRead(strata: readonly StratumInfo[], parts: readonly StratumPart[]): void;
  /**
   * Hands over the exclusions as soon as every exclusion file is read, before anything is checked,
   * so the other thread measures part areas while this one checks the map. `finish` must get a site
   * with this very list, or it gives null.
   */
  exclusionsRead(exclusions: readonly Exclusion[]): void;
  /**
   * Hands over the exclusions of the checked site (unless exclusionsRead already has), takes a
   * share of the jobs in this thread, and waits for the other thread's; null when the two cannot
   * together make every stage (the design then makes them itself, and reports any error as it
   * always does).
   */
  finish(site: Site): Promise<{ made: DesignStagesMade; otherThreadJobs: number } | null>;
  /** Ends the second thread (an error ended the command, or the stages are made). */
  stop(): void;
}

type Reply =
  | { kind: 'strata'; made: { index: number; shape: StratumOutlineXY }[] }
  | { kind: 'parts'; made: { index: number; areas: PartAreas }[] }
  | { kind: 'failed'; message: string };

/** Threads the command line uses: STRATPLOT_THREADS=1 keeps every stage in the main thread (documented in the README). */
export function designThreads(env: NodeJS.ProcessEnv = process.env): 1 | 2 {
  if (env.STRATPLOT_THREADS === '1') return 1;
  return availableParallelism() >= 2 ? 2 : 1;
}

/**
 * Starts the second thread of `stratplot plan`, or gives null where it cannot help (one thread
 * asked for or available, or no bundled worker at `url`, beside this file, as when run from the sources).
 * Work is shared by two counters in shared memory, one for stratum jobs (each stratum's outline,
 * with its triangles or cell grid, whichever the design samples by: stratumMade) and one for part
 * jobs (each part's areas, partAreasMeasurer): each thread takes the next job until none is left,
 * so neither waits on a slow share. The main thread joins once it has checked the map; the
 * exclusions come over as soon as they are read, so the other thread measures part areas during
 * that check. Each job is the same code on the same numbers in either thread, so the design is
 * byte for byte the one a single thread makes (tested).
 */
export function designStagesAhead(
  sampling: StratumSampling,
  threads: 1 | 2 = designThreads(),
  url = new URL('./designStagesWorker.mjs', import.meta.url),
): DesignStagesAhead | null {
  if (threads < 2) return null;
  if (url.protocol !== 'file:' || !existsSync(fileURLToPath(url))) return null;
  const worker = new Worker(url);
  // Never holds the process open: the command ends when its own work does.
  worker.unref();
  const counters = new Int32Array(new SharedArrayBuffer(8));
  const replies: Reply[] = [];
  let waiting: (() => void) | null = null;
  let broken = false;
  const wake = () => {
    const w = waiting;
    waiting = null;
    w?.();
  };
  worker.on('message', (r: Reply) => {
    replies.push(r);
    wake();
  });
  worker.on('error', () => {
    broken = true;
    wake();
  });
  worker.on('exit', () => {
    broken = true;
    wake();
  });
  const next = async (): Promise<Reply | null> => {
    while (replies.length === 0 && !broken) await new Promise<void>((resolve) => (waiting = resolve));
    return replies.shift() ?? null;
  };
  let sent = false;
  let sentExclusions: readonly Exclusion[] | null = null;
  return {
    strataRead(strata, parts) {
      // The design will refuse such a polygon; triangulating it first would only keep the refusal waiting.
      if (sampling === 'triangles' && placementPolygonOver(parts)) return;
      const packed = stratumPartsPack(parts);
      worker.postMessage({ kind: 'strata', strata, parts: packed, counters: counters.buffer, sampling }, [
        packed.coords.buffer as ArrayBuffer,
        packed.ringVertices.buffer as ArrayBuffer,
        packed.polygonRings.buffer as ArrayBuffer,
        packed.partPolygons.buffer as ArrayBuffer,
      ]);
      sent = true;
    },
    exclusionsRead(exclusions) {
      if (!sent || sentExclusions) return;
      worker.postMessage({ kind: 'exclusions', exclusions });
      sentExclusions = exclusions;
    },
    async finish(site) {
      if (!sent) return null;
      // The other thread's part areas would be measured against another list: make every stage here.
      if (sentExclusions && sentExclusions !== site.exclusions) return null;
      try {
        if (!sentExclusions) worker.postMessage({ kind: 'exclusions', exclusions: site.exclusions });
        const frame = siteLocalFrame(site.parts);
        const strata: (StratumOutlineXY | undefined)[] = new Array(site.strata.length);
        const partAreas: (PartAreas | undefined)[] = new Array(site.parts.length);
        let mine = jobsTake(counters, 0, strata.length, (k) => {
          strata[k] = stratumMade(stratumPolygons(site, site.strata[k].key), frame, sampling);
        });
        const measure = partAreasMeasurer(site, frame);
        mine += jobsTake(counters, 1, partAreas.length, (k) => {
          partAreas[k] = measure(k);
        });
        if (mine < strata.length + partAreas.length) {
          for (let got = 0; got < 2; got++) {
            const r = await next();
            if (!r || r.kind === 'failed') return null;
            if (r.kind === 'strata') for (const { index, shape } of r.made) strata[index] = shape;
            else for (const { index, areas } of r.made) partAreas[index] = areas;
          }
        }
        if (strata.includes(undefined) || partAreas.includes(undefined)) return null;
        const made = { strata: strata as StratumOutlineXY[], partAreas: partAreas as PartAreas[] };
        return { made, otherThreadJobs: strata.length + partAreas.length - mine };
      } catch {
        return null;
      } finally {
        void worker.terminate();
      }
    },
    stop() {
      void worker.terminate();
    },
  };
}

import { temporal } from 'zundo';
import { createStore, type StoreApi } from 'zustand/vanilla';
import type { DesignSettings, PlotCollection } from '../core/designTypes';
import type { Site } from '../core/types';
import type { SiteAnalysis } from '../worker/siteAnalyse';

/** Which kind of thing a drawing tool makes. */
export type DrawTool = 'none' | 'stratum' | 'stratum-beside' | 'hole' | 'cliff' | 'creek' | 'water' | 'private' | 'hazard' | 'access' | 'baseline' | 'edit';

/** What the map has selected: a stratum part, an exclusion, an access point or a plot. */
export type Selection =
  | { kind: 'part'; id: string }
  | { kind: 'exclusion'; id: string }
  | { kind: 'access'; id: string }
  | { kind: 'plot'; id: string }
  | null;

/** Progress of a design running in the worker. */
export interface DesignJob {
  fraction: number;
  stage: string;
}

/** A message for the person at the screen: what happened or what is wrong. */
export interface Notice {
  tone: 'info' | 'error';
  text: string;
}

/** Everything the planner holds. Only `site` is in the undo history. */
export interface PlannerState {
  site: Site;
  design: DesignSettings;
  /** The design; its plots carry their field state (rejections and promotions live there only). */
  result: PlotCollection | null;
  /** True once the site has changed after the result was made. */
  resultStale: boolean;
  /** Attribute chosen to group imported polygons into strata. */
  strataField: string;
  /** Bumps on every change worth saving. */
  revision: number;
  /** Revision last written to a plan file (or opened from one). */
  savedRevision: number;
  tool: DrawTool;
  /** Stratum that new stratum polygons go into; null makes a new stratum for each. */
  drawStratumKey: string | null;
  selection: Selection;
  job: DesignJob | null;
  notice: Notice | null;
  /** A place the map should fly to, [west, south, east, north]; consumed by the map. */
  /** Areas, buffered ground and problems of `analysis.site` (worked out off the main thread). */
  analysis: (SiteAnalysis & { site: Site }) | null;
  /** The imagery under the map (not saved in the plan: the file stays on this computer). */
  imagery: { label: string; opacity: number; pixelSizeM: number } | null;
  /** Online tiles under the plan: off unless the user turns them on; `status` says how they are doing. */
  onlineTiles: { enabled: boolean; status: string };
  focus: { bbox: [number, number, number, number]; at: number } | null;
}

export type PlannerStore = StoreApi<PlannerState> & {
  temporal: StoreApi<import('zundo').TemporalState<Pick<PlannerState, 'site'>>>;
};

/** An empty site: no strata, no exclusions. */
export function siteEmpty(name = 'Untitled site'): Site {
  return { name, strata: [], parts: [], exclusions: [], access: [], boundary: null };
}

/**
 * Creates the planner store (zustand vanilla + zundo). The undo history holds the site only, so
 * undo and redo step through map edits and never through design settings or field decisions.
 */
export function plannerStoreCreate(design: DesignSettings, site: Site = siteEmpty()): PlannerStore {
  return createStore<PlannerState>()(
    temporal<PlannerState, [], [], Pick<PlannerState, 'site'>>(
      (): PlannerState => ({
        site,
        design,
        result: null,
        resultStale: false,
        strataField: 'stratum',
        revision: 0,
        savedRevision: 0,
        tool: 'none',
        drawStratumKey: null,
        selection: null,
        job: null,
        notice: null,
        analysis: null,
        imagery: null,
        onlineTiles: { enabled: false, status: 'off' },
        focus: null,
      }),
      {
        partialize: (s) => ({ site: s.site }),
        equality: (a, b) => a.site === b.site,
        limit: 200,
      },
    ),
  ) as PlannerStore;
}

import { temporal } from 'zundo';
import { createStore, type StoreApi } from 'zustand/vanilla';
import type { DesignSettings, PlotCollection } from '../core/model/designTypes';
import { FIELD_SETUP_EMPTY, type FieldSetup } from '../core/model/fieldTypes';
import type { ResultsSnapshot } from './planFileTypes';
import type { Site } from '../core/model/types';
import type { SiteAnalysis } from '../core/design/siteAnalyse';

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

/** The planner's steps, in the order a plan is made. */
export const PLANNER_STEPS = [
  { id: 'strata', label: 'Map strata' },
  { id: 'exclusions', label: 'Mark exclusions' },
  { id: 'design', label: 'Design' },
  { id: 'plots', label: 'Plots' },
  { id: 'results', label: 'Results' },
] as const;
export type PlannerStep = (typeof PLANNER_STEPS)[number]['id'];

/** Which plan is on screen: what it was opened from, and a number that changes whenever a plan replaces another. */
export interface PlanOpened {
  what: string;
  serial: number;
}

/**
 * Everything the planner holds. The plan (site, design, result, field decisions and whatever else
 * is added to it) is in the undo history; the keys in {@link PLANNER_VIEW_KEYS} are how it is being
 * looked at and are not.
 */
export interface PlannerState {
  site: Site;
  design: DesignSettings;
  /** The design; its plots carry their field state (rejections and promotions live there only). */
  result: PlotCollection | null;
  /** Who walks the plan, what they measure at each plot, and the arrival radius (the field view's setup). */
  field: FieldSetup;
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
  /** The step whose sheet is shown. */
  step: PlannerStep;
  /** Which plan this is (changes when Open plan, Demo site or a kept version replaces it). */
  planOpened: PlanOpened;
  /** The Results step's work that belongs with this plan when it is left by a replacement (see planReplace). */
  resultsKept: ResultsSnapshot | null;
}

/** State that is how the plan is looked at, not the plan: never in the undo history. */
export const PLANNER_VIEW_KEYS = [
  'revision',
  'savedRevision',
  'strataField',
  'tool',
  'drawStratumKey',
  'selection',
  'job',
  'notice',
  'analysis',
  'imagery',
  'onlineTiles',
  'focus',
  'step',
] as const satisfies readonly (keyof PlannerState)[];

/** The part of the state the undo history keeps: everything but the view. */
export type PlannerPlan = Omit<PlannerState, (typeof PLANNER_VIEW_KEYS)[number]>;

const VIEW_KEYS = new Set<string>(PLANNER_VIEW_KEYS);

/** The plan part of a state (see {@link PlannerPlan}). */
export function plannerPlanOf(s: PlannerState): PlannerPlan {
  const plan: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(s)) if (!VIEW_KEYS.has(k)) plan[k] = v;
  return plan as unknown as PlannerPlan;
}

/** True when two plan parts hold the same objects (every edit makes new objects, so this is enough). */
function plannerPlanSame(a: PlannerPlan, b: PlannerPlan): boolean {
  const keys = new Set([...Object.keys(a), ...Object.keys(b)]);
  for (const k of keys) if ((a as unknown as Record<string, unknown>)[k] !== (b as unknown as Record<string, unknown>)[k]) return false;
  return true;
}

export type PlannerStore = StoreApi<PlannerState> & {
  temporal: StoreApi<import('zundo').TemporalState<PlannerPlan>>;
};

/** An empty site: no strata, no exclusions. */
export function siteEmpty(name = 'Untitled site'): Site {
  return { name, strata: [], parts: [], exclusions: [], access: [], boundary: null };
}

/**
 * Creates the planner store (zustand vanilla + zundo). The undo history holds the whole plan:
 * map edits, design settings, the design made, field decisions and plan replacements are each a
 * step; the view (step, tool, selection, messages, progress) is not.
 */
export function plannerStoreCreate(design: DesignSettings, site: Site = siteEmpty()): PlannerStore {
  return createStore<PlannerState>()(
    temporal<PlannerState, [], [], PlannerPlan>(
      (): PlannerState => ({
        site,
        design,
        result: null,
        field: FIELD_SETUP_EMPTY,
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
        step: 'strata',
        planOpened: { what: 'a new plan', serial: 0 },
        resultsKept: null,
      }),
      {
        partialize: plannerPlanOf,
        equality: plannerPlanSame,
        limit: 200,
      },
    ),
  ) as PlannerStore;
}

import type { FeatureCollection, Point } from 'geojson';
import type { ExclusionKind } from './types';

/** The kinds of variable a crew records, which decide the range checks. */
export const RESULT_KINDS = ['measure', 'cover', 'count', 'presence'] as const;
export type ResultKind = (typeof RESULT_KINDS)[number];

/**
 * Which random streams made a design. 1: one xoroshiro128+ stream seeded almost directly by the seed
 * (designs made before the version was recorded; neighbouring seeds give correlated designs).
 * 2: the seed expanded by splitmix64, with a separate, named stream for each stratum and method.
 * 3: the streams of version 2, with random plots drawn from a grid of cells over each stratum and
 * points tested against the cells, instead of the stratum's triangles (no triangulation).
 */
export type RngVersion = 1 | 2 | 3;

/** A plot's footprint on the ground, in metres; angles clockwise from true north. */
export type Footprint =
  | { shape: 'point' }
  | { shape: 'square'; sideM: number; angleDeg: number }
  | { shape: 'rect'; widthM: number; heightM: number; angleDeg: number }
  | { shape: 'circle'; radiusM: number };

export type AllocationMethod = 'proportional' | 'equal' | 'neyman';
export type PlacementMethod = 'random' | 'balanced' | 'grid' | 'transect';
export type ShareBasis = 'usable' | 'mapped';

/** Every setting of a design; stored in the plan file and in the `design` member of plot files. */
export interface DesignSettings {
  /** Total primary plots; ignored when `targetHalfwidth` or `budget` is set (then the size is computed). */
  plots: number;
  allocation: AllocationMethod;
  shareBasis: ShareBasis;
  minPerStratum: number;
  /** Pilot standard deviations by stratum key (Neyman and target precision). */
  sd: Record<string, number>;
  /** Cost per plot by stratum key: relative for Neyman, in the budget's units with `budget`; 1 when absent. */
  cost: Record<string, number>;
  /**
   * Size the design by a budget: total C and fixed overhead c0 (same units as `cost`); the design is
   * the largest whose plots cost at most C − c0. Absent or null: sized by `plots` or the target.
   */
  budget?: { total: number; overhead: number } | null;
  /** Target half-width of the 95 % CI of the stratified mean: absolute, or relative to `pilotMean`. */
  targetHalfwidth: { value: number; relative: boolean } | null;
  pilotMean: number | null;
  spacingM: number;
  footprint: Footprint;
  edgeBufferM: number;
  reservePerStratum: number;
  method: PlacementMethod;
  gridSpacingM: number | null;
  gridAngleDeg: number;
  /** Baseline for transects, WGS84 [lon, lat] vertices. */
  baseline: number[][] | null;
  transectIntervalM: number | null;
  quadratIntervalM: number | null;
  seed: number;
  /**
   * Which random streams turn the seed into plots (see `RngVersion`). Absent in plans and plot files
   * saved before it was recorded: those were made with version 1, and are made again with it.
   */
  rngVersion?: RngVersion;
  /** When a stratum cannot hold its plots, move the shortfall to strata with room (proportionally). */
  redistributeShortfall?: boolean;
}

/** One row of the allocation table. */
export interface AllocationRow {
  stratum: string;
  mapped_m2: number;
  usable_m2: number;
  share: number;
  plots: number;
  reserve: number;
  /** How many plots the stratum could hold under the spacing and footprint (null: not limited/unknown). */
  capacity: number | null;
}

export type PlotRole = 'primary' | 'reserve';

/**
 * A plot's stored field status: as designed, rejected by the crew, or a reserve promoted in a
 * rejected plot's place. With `reject_reason`, `rejected_at` and `replaces` it is the plot's
 * field state, the one record every screen and file reads (through `plotFieldState`).
 */
export type PlotStatus = 'planned' | 'rejected' | 'promoted';

/** Properties of one plot, as written to plot files (snake_case is the file format). */
export interface PlotProperties {
  plot_id: string;
  /**
   * The plot's stratum: its stable id (`StratumInfo.key`) while the planner holds the design, its
   * current name in every file written (see `plotCollectionNamed`).
   */
  stratum: string;
  /** The stratum's current code, in files written. */
  stratum_code?: string;
  /** The stratum's stable id, in plan files only (where `stratum` carries the name). */
  stratum_id?: string;
  role: PlotRole;
  rank: number;
  lon: number;
  lat: number;
  utm_zone: string;
  easting: number;
  northing: number;
  mgrs: string;
  nearest_exclusion_m: number | null;
  nearest_exclusion_kind: ExclusionKind | null;
  design_density_per_ha: number;
  /** Transect designs only. */
  transect?: number;
  chainage_m?: number;
  /**
   * In files written: the field state as a symbol key (primary, reserve, promoted, rejected) and
   * as a sentence for the crew. Worked out from the fields below on every write, never read back.
   */
  field_state?: 'primary' | 'reserve' | 'promoted' | 'rejected';
  field_note?: string;
  /** Field state (see {@link PlotStatus}): set when a crew reports back. */
  status?: PlotStatus;
  reject_reason?: string;
  /** When the plot was rejected, ISO 8601 (absent in files written before it was recorded). */
  rejected_at?: string;
  /** The plot id a promoted reserve replaces (kept when that reserve is itself rejected). */
  replaces?: string;
  notes?: string;
  /** When a crew recorded the plot as visited, ISO 8601, and who (the crew name); see plotVisit. */
  visited_at?: string;
  visited_by?: string;
  /** Where the device put the crew when the visit was recorded, WGS84 degrees, and its accuracy, metres (absent without a position). */
  visit_lon?: number;
  visit_lat?: number;
  visit_accuracy_m?: number;
  /** The measurements typed on site, as typed, by variable name (the plan's field variables). */
  field_values?: Record<string, string>;
  /** The crew's free-text note on the plot. */
  crew_note?: string;
  /** Navigation added for field kits: the access point measured from, geodesic distance, bearings. */
  access_point?: string;
  distance_m?: number;
  bearing_true_deg?: number;
  bearing_mag_deg?: number;
  /** Declination used for `bearing_mag_deg`, degrees east positive, and its model, e.g. "WMM-2025, epoch 2025.0, for 2026.20". */
  declination_deg?: number;
  mag_model?: string;
}

/** Summary of a design, the `design` member of a plot file. */
export interface DesignSummary {
  settings: DesignSettings;
  seed: number;
  crs: { utm_zone: string; epsg: number };
  allocation: AllocationRow[];
  warnings: string[];
  /** What the estimates will cover, and the reserve rule, in words. */
  statements: string[];
  software: { name: 'stratplot'; version: string };
}

/** A plot file: GeoJSON points plus the design that made them. */
export type PlotCollection = FeatureCollection<Point, PlotProperties> & { design: DesignSummary };

/**
 * A field decision as read from the plots' field state (never stored on its own): a plot a crew
 * could not sample and what replaced it.
 */
export interface FieldRejection {
  plot_id: string;
  reason: string;
  /** Reserve promoted in its place, or null when the stratum had none left. */
  replacement: string | null;
  /** ISO 8601, or null when the file did not record the time. */
  at: string | null;
}


import type { Footprint, PlotRole, PlotStatus } from '../model/designTypes';
import type { ExclusionKind } from '../model/types';

/** A plot from someone else's file (a contractor's design, last season's plots, GPS waypoints). */
export interface PlotToCheck {
  /** Its id or name as the file gives it (ids may repeat: that is one of the checks). */
  id: string;
  /** Where it is in the file, for messages: "feature 3", "row 4". */
  where: string;
  /** WGS84 degrees. */
  lon: number;
  lat: number;
  /** From stratplot plot files: waiting reserves and rejected plots are checked but not counted as sample plots. */
  role?: PlotRole;
  status?: PlotStatus;
  replaces?: string;
}

/** How to check: the same settings a design is placed with. */
export interface PlotsCheckOptions {
  /** Minimum metres between plot centres (0: no spacing test). */
  spacingM: number;
  footprint: Footprint;
  /** Ground metres each footprint keeps from its stratum's boundary. */
  edgeBufferM: number;
  /** Date of the survey, for the magnetic declination at the access points. */
  surveyDate: Date;
  /** Positive limits are met to within this many metres (default {@link PLOT_CHECK_SLACK_M}). */
  slackM?: number;
}

/**
 * Limits (buffers, edge buffer, spacing) count as met to within 2 cm: plot files hold positions to
 * 1e-7° (about 1 cm), so a plot placed just clear of a buffer may come back a few millimetres short of
 * it. Common practice, no source.
 */
export const PLOT_CHECK_SLACK_M = 0.02;

/** Plots closer than this (metres) are at the same position. Common practice, no source. */
export const PLOT_SAME_POSITION_M = 0.01;

/** What a plot fails, most serious first (the order of {@link PLOT_PROBLEM_CODES}). */
export const PLOT_PROBLEM_CODES = ['excluded', 'outside-strata', 'in-hole', 'stratum-edge', 'duplicate-position', 'duplicate-id', 'spacing'] as const;
export type PlotProblemCode = (typeof PLOT_PROBLEM_CODES)[number];

/** One failed check, as a sentence that names the plot (and the exclusion or other plot). */
export interface PlotProblem {
  code: PlotProblemCode;
  text: string;
}

/** A stratum by its stable id and current name and code. */
export interface CheckedStratum {
  id: string;
  name: string;
  code: string;
}

/** An exclusion a plot (or its footprint) is on, inside the exclusion widened by its buffer. */
export interface PlotExclusionHit {
  exclusionId: string;
  kind: ExclusionKind;
  /** The exclusion's name, or its id when it has none. */
  name: string;
  bufferM: number;
  /** Ground metres from the plot centre to the mapped exclusion; inside a polygon, to its edge. */
  distanceM: number;
  /** Ground metres from the footprint to the mapped exclusion (0 when it touches or overlaps). */
  footprintM: number;
  /** The plot centre lies inside the exclusion polygon. */
  inside: boolean;
}

/** Distance from a plot to the nearest exclusion of one kind. */
export interface PlotNearestExclusion {
  exclusionId: string;
  name: string;
  /** Ground metres from the plot centre to the mapped exclusion (0 inside a polygon). */
  distanceM: number;
}

/** The route to a plot from its nearest access point. */
export interface PlotAccess {
  accessPointId: string;
  accessPointName: string;
  /** Geodesic metres. */
  distanceM: number;
  bearingTrueDeg: number;
  bearingMagDeg: number;
  declinationDeg: number;
}

/** Everything checked about one plot. */
export interface PlotCheckRecord {
  /** Position in the input list. */
  index: number;
  id: string;
  where: string;
  lon: number;
  lat: number;
  ok: boolean;
  /** 0 when the plot passes; else larger for more serious problems (see {@link PLOT_PROBLEM_CODES}). */
  severity: number;
  problems: PlotProblem[];
  /** The stratum the plot falls in, or null (outside every stratum, or in a hole). */
  stratum: CheckedStratum | null;
  /** When the plot is in a hole: the stratum around the hole. */
  holeIn: CheckedStratum | null;
  /** Ground metres from the footprint to its stratum's boundary, when there is an edge test (a footprint or an edge buffer). */
  edgeM: number | null;
  /** The footprint crosses the boundary or enters the edge buffer (placement would refuse it). */
  edgeBroken: boolean;
  exclusions: PlotExclusionHit[];
  nearestByKind: Partial<Record<ExclusionKind, PlotNearestExclusion>>;
  /** The nearest other plot of the set (geodesic metres), or null for a set of one. */
  nearestPlot: { index: number; id: string; distanceM: number } | null;
  spacingBroken: boolean;
  /** Other plots at the same position. */
  samePosition: { index: number; id: string; where: string }[];
  /** How many plots in the set carry this id (1 when unique). */
  idCount: number;
  access: PlotAccess | null;
  /** Counted as a sample plot (not a waiting reserve or a rejected plot of a stratplot file). */
  counted: boolean;
  /** The field status the file gave, if any. */
  status?: PlotStatus;
}

/** One stratum's plots against a proportional allocation on its usable area. */
export interface StratumCheckRow extends CheckedStratum {
  mappedM2: number;
  usableM2: number;
  /** Sample plots of the set in the stratum, and how many of them pass. */
  plots: number;
  passing: number;
  /** Plots a proportional allocation of the set's sample plots on the usable area gives the stratum. */
  proportional: number;
}

/** The whole check: every plot, the strata, and plain notes about the set. */
export interface PlotsCheckReport {
  plots: PlotCheckRecord[];
  strata: StratumCheckRow[];
  /** Statements about the set as a sample (strata without plots, plots on excluded ground...). */
  notes: string[];
  /** Things the check could not do, or did with a caveat (no access points, an area counted on a grid). */
  warnings: string[];
  counts: { plots: number; passing: number; failing: number; counted: number };
  settings: { spacingM: number; footprint: Footprint; edgeBufferM: number; slackM: number; surveyDate: string };
  crs: { utm_zone: string; epsg: number };
  /** The magnetic model used for the bearings, when the site has access points. */
  magnetic: { model: string; epoch: number; decimalYear: number } | null;
}

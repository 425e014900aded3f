import type { DesignSettings, PlotCollection, ResultKind } from '../core/model/designTypes';
import type { FieldSetup } from '../core/model/fieldTypes';
import type { Site, StratumPart } from '../core/model/types';

/** The plan-file version this program writes; older versions are migrated on open (planFileMigrate). */
export const PLAN_FILE_VERSION = 2;

/**
 * The plan as the planner holds it: everything needed to reproduce and continue a design. Field
 * decisions live on the plots of `result` (their field state); see ARCHITECTURE.md for how the
 * file spells it (stratum ids and names, plots named as in plot files).
 */
export interface PlanFile {
  format: 'stratplot-plan';
  version: typeof PLAN_FILE_VERSION;
  savedAt: string;
  site: Site;
  design: DesignSettings;
  result: PlotCollection | null;
  /** The field setup: crew name, variables to measure, arrival radius (absent in plans saved before the field view). */
  field?: FieldSetup;
  /** The Results step's work (absent in plans saved before it was kept, or with nothing entered). */
  results?: ResultsSnapshot;
}

/** A stratum as the plan file spells it: its stable id, current name, code and colour. */
export interface PlanStratum {
  id: string;
  name: string;
  code: string;
  colour: string;
}

/** A mapped stratum feature as the plan file spells it: it names its stratum by id. */
export interface PlanPart {
  id: string;
  stratum_id: string;
  geometry: StratumPart['geometry'];
  properties?: Record<string, unknown>;
}

/**
 * The plan file as written (version 2): the held plan with strata spelled as {@link PlanStratum},
 * parts as {@link PlanPart}, and the result named as a plot file is, each plot and allocation row
 * also carrying its `stratum_id`. Design settings keyed by stratum (pilot SDs, costs) use the id.
 */
export interface PlanFileDocument extends Omit<PlanFile, 'site'> {
  site: Omit<Site, 'strata' | 'parts'> & { strata: PlanStratum[]; parts: PlanPart[] };
}

/** A recapture grid as the planner typed it: every number kept as text, half-typed ones too. */
export interface RecaptureGridSaved {
  id: string;
  name: string;
  marked: string;
  caught: string;
  recaptured: string;
  stripM: string;
  /** How the grid's extent is given: its area, or stations in rows and columns. */
  by: 'stations' | 'area';
  areaHa: string;
  spacingM: string;
  rows: string;
  cols: string;
}

/**
 * What the Results step keeps in the plan file: the results CSV as text, which columns mean what,
 * the options chosen and the recapture forms. Estimates are not kept: they are worked out again.
 */
export interface ResultsSnapshot {
  fileName: string | null;
  csvText: string | null;
  mapping: { idColumn: string; statusColumn: string | null; replacedByColumn: string | null; kinds: Record<string, ResultKind> } | null;
  variable: string | null;
  collapse: boolean;
  perHa: boolean;
  /** Next season's target half-width: a fraction of the mean when relative, else in the variable's units. */
  target: { value: number; relative: boolean };
  colourOn: boolean;
  grids: RecaptureGridSaved[];
}

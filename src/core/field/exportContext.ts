import type { LocalFrame } from '../geo/localFrame';
import type { PlotCollection } from '../model/designTypes';
import type { Site } from '../model/types';
import { designFrame } from './designFrame';
import { plotCollectionForField } from './plotCollectionForField';
import { plotCollectionNamed } from './plotCollectionNamed';
import { type PlotsAnnotateOptions, plotsAnnotate } from './plotsAnnotate';

/**
 * Everything the writers of one export share, worked out once: the plots named as the plan names
 * them now, with their route and safety notes and their field state, the frame the design was
 * placed in, the survey date, and the strata's codes by current name. Every writer of the export
 * (navigation files, tables, PDFs) reads these instead of working them out again.
 */
export interface ExportContext {
  site: Site | null;
  /** The plots with each stratum by its current name and code (plotCollectionNamed). */
  named: PlotCollection;
  /** `named` with access-point navigation and safety notes when a site is given (plotsAnnotate). */
  annotated: PlotCollection;
  /** `annotated` with every plot's field state and what it means for the crew (plotCollectionForField). */
  field: PlotCollection;
  /** The design's recorded UTM frame (designFrame), null when there is nothing to place one on. */
  frame: LocalFrame | null;
  /** The day of the survey, for magnetic bearings and the sheets; now when not given. */
  surveyDate: Date;
  /** Each stratum's code by its current name. */
  codeOfStratum: ReadonlyMap<string, string>;
  /** The access point the crew starts from, when one was chosen. */
  accessPointId?: string;
}

/** How {@link exportContext} annotates: safety thresholds and access point, or `false` for plots as they are. */
export interface ExportContextOptions {
  surveyDate?: Date;
  annotate?: Omit<PlotsAnnotateOptions, 'surveyDate'> | false;
}

function isAnnotated(collection: PlotCollection): boolean {
  return 'annotation' in collection || collection.features.some((f) => f.properties.distance_m !== undefined);
}

/**
 * Builds the {@link ExportContext} of one export. Plots that already carry navigation are not
 * annotated twice (their notes would repeat).
 * @throws InputError from plotsAnnotate (an unknown access point, a bad threshold).
 */
export function exportContext(collection: PlotCollection, site: Site | null, options: ExportContextOptions = {}): ExportContext {
  const surveyDate = options.surveyDate ?? new Date();
  const named = site ? plotCollectionNamed(collection, site.strata) : collection;
  const frame = designFrame(collection, site);
  const annotate = options.annotate || {};
  const annotated = site && options.annotate !== false && !isAnnotated(named) ? plotsAnnotate(named, site, { ...annotate, surveyDate, frame: frame ?? undefined }) : named;
  return {
    site,
    named,
    annotated,
    field: plotCollectionForField(annotated),
    frame,
    surveyDate,
    codeOfStratum: new Map((site?.strata ?? []).map((s) => [s.label, s.code])),
    accessPointId: annotate.accessPointId,
  };
}

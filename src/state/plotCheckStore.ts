import { createStore, type StoreApi } from 'zustand/vanilla';
import type { Footprint } from '../core/model/designTypes';
import { footprintFormat, footprintParse } from '../core/design/footprintParse';
import { InputError, isInputError } from '../core/common/InputError';
import type { PlotsCheckOptions, PlotsCheckReport, PlotToCheck } from '../core/plotCheck/plotCheckTypes';
import { plotsCheck } from '../core/plotCheck/plotsCheck';
import type { Site } from '../core/model/types';
import type { FeatureFileOptions } from '../io/site/parseFeatureFile';
import { plotsFromFeatures } from '../io/plots/plotsFromFeatures';
import { importAttempt } from './importActions';
import type { ImportNeeds } from './importNeeds';

/** What the checks use, as the form holds them (the footprint as text, the date as YYYY-MM-DD). */
export interface PlotCheckSettings {
  spacingM: number;
  footprintText: string;
  edgeBufferM: number;
  surveyDate: string;
}

/** A plots file that still needs a choice (a layer, an EPSG code, CSV columns) before it can be read. */
export interface PlotCheckPending {
  fileName: string;
  bytes: Uint8Array;
  options: FeatureFileOptions;
  needs: ImportNeeds;
  problem: string | null;
  round: number;
}

export interface PlotCheckState {
  fileName: string | null;
  pending: PlotCheckPending | null;
  plots: PlotToCheck[] | null;
  /** What the reader left out of the file (lines, the site's own features). */
  readWarnings: string[];
  settings: PlotCheckSettings;
  report: PlotsCheckReport | null;
  /** The site the report was worked out for: when the plan's site changes, the check is run again. */
  reportSite: Site | null;
  busy: boolean;
  /** Why the file could not be read or checked (the previous check, if any, stays). */
  error: string | null;
  /** Index of the checked plot picked in the table or on the map. */
  selected: number | null;
  /** Draw the design's own plots beside the checked ones (off: the checked plots instead of the design). */
  showDesign: boolean;
}

export type PlotCheckStore = StoreApi<PlotCheckState>;

/** Works out a check; the planner runs it in the worker, tests call the core directly. */
export type PlotCheckRunner = (site: Site, plots: PlotToCheck[], options: PlotsCheckOptions) => Promise<PlotsCheckReport>;

/** A check run in this thread. */
export const plotCheckRunHere: PlotCheckRunner = async (site, plots, options) => plotsCheck(site, plots, options);

/** A new, empty check store (zustand vanilla) starting from the design's spacing, footprint and edge buffer. */
export function plotCheckStoreCreate(from: { spacingM: number; footprint: Footprint; edgeBufferM: number }, today = new Date()): PlotCheckStore {
  return createStore<PlotCheckState>()(() => ({
    fileName: null,
    pending: null,
    plots: null,
    readWarnings: [],
    settings: { spacingM: from.spacingM, footprintText: footprintFormat(from.footprint), edgeBufferM: from.edgeBufferM, surveyDate: today.toISOString().slice(0, 10) },
    report: null,
    reportSite: null,
    busy: false,
    error: null,
    selected: null,
    showDesign: true,
  }));
}

function message(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}

/** The form's settings as the check takes them. Throws InputError for a footprint or date it cannot read. */
function plotCheckOptionsOf(s: PlotCheckSettings): PlotsCheckOptions {
  const surveyDate = new Date(/^\d{4}-\d{2}-\d{2}$/.test(s.surveyDate) ? `${s.surveyDate}T12:00:00Z` : 'invalid');
  if (Number.isNaN(surveyDate.getTime())) throw new InputError(`survey date "${s.surveyDate}" is not a date (YYYY-MM-DD)`);
  return { spacingM: s.spacingM, footprint: footprintParse(s.footprintText, 'footprint'), edgeBufferM: s.edgeBufferM, surveyDate };
}

/**
 * Reads a plots file (any format the planner reads), unless it first needs a choice, which is then
 * asked for in `pending`; read, its points become the plots to check and the check runs against
 * `site`. A file that cannot be read leaves the previous check as it was and says why in `error`.
 */
export async function plotCheckFileRead(store: PlotCheckStore, fileName: string, bytes: Uint8Array, options: FeatureFileOptions, site: Site, run: PlotCheckRunner, round = 0): Promise<void> {
  store.setState({ busy: true, error: null });
  try {
    const got = await importAttempt(fileName, bytes, options);
    if ('needs' in got) {
      store.setState({ busy: false, pending: { fileName, bytes, options, needs: got.needs, problem: null, round: round + 1 } });
      return;
    }
    const read = plotsFromFeatures(got.preview.features, { fileName });
    store.setState({ fileName, plots: read.plots, readWarnings: read.warnings, pending: null, selected: null, report: null, reportSite: null });
  } catch (e) {
    if (!isInputError(e)) throw e;
    const pending = store.getState().pending;
    store.setState({ busy: false, ...(round > 0 && pending ? { pending: { ...pending, problem: message(e) } } : { error: message(e) }) });
    return;
  }
  await plotCheckRun(store, site, run);
}

/** Checks the loaded plots against `site` with the current settings; a user-facing problem goes to `error`. */
export async function plotCheckRun(store: PlotCheckStore, site: Site, run: PlotCheckRunner): Promise<void> {
  const { plots, settings } = store.getState();
  if (!plots) return;
  store.setState({ busy: true, error: null });
  try {
    const report = await run(site, plots, plotCheckOptionsOf(settings));
    store.setState({ report, reportSite: site, busy: false });
  } catch (e) {
    if (!isInputError(e)) {
      store.setState({ busy: false, error: `The plots could not be checked: ${message(e)}` });
      return;
    }
    store.setState({ busy: false, error: message(e), report: null, reportSite: null });
  }
}

/** Changes the spacing, footprint, edge buffer or survey date (check again to apply). */
export function plotCheckSettingsSet(store: PlotCheckStore, patch: Partial<PlotCheckSettings>): void {
  store.setState((s) => ({ settings: { ...s.settings, ...patch } }));
}

/** Unloads the checked plots (the design is untouched). */
export function plotCheckClear(store: PlotCheckStore): void {
  store.setState({ fileName: null, pending: null, plots: null, readWarnings: [], report: null, reportSite: null, busy: false, error: null, selected: null });
}

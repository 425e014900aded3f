import type { PlotCollection } from '../model/designTypes';
import { plotNavigation } from './plotNavigation';
import { plotSafetyNotes, type SafetyThresholds } from './plotSafetyNotes';
import { designFrame } from './designFrame';
import type { LocalFrame } from '../geo/localFrame';
import type { Site } from '../model/types';

export interface PlotsAnnotateOptions extends Partial<SafetyThresholds> {
  /** Access point to measure from; each plot's nearest access point when absent. */
  accessPointId?: string;
  /** Survey date for the magnetic declination (default: now). */
  surveyDate?: Date;
  altitudeKm?: number;
  /** The frame to measure safety distances in (default: the design's recorded frame, designFrame). */
  frame?: LocalFrame;
}

/** What the annotation found beyond the per-plot properties. */
export interface PlotsAnnotateInfo {
  model: string;
  epoch: number;
  decimalYear: number;
  warnings: string[];
  thresholds: SafetyThresholds;
}

/** Separator between joined safety notes in the `notes` property (plain ASCII for GPS units). */
export const NOTES_SEPARATOR = ' | ';

/**
 * Adds navigation (access point, geodesic distance, true and magnetic bearing, declination and
 * model) and joined safety notes to every plot, without changing anything else. Plots keep any
 * notes they had; the safety notes follow them. Without access points only the geometry notes are added.
 * @returns a new collection (the input is not modified) with `annotation` info alongside.
 * @throws InputError for an unknown access point or a bad threshold.
 * Source: geodesics after Karney (2013); declination from WMM2025; thresholds common practice, no source.
 */
export function plotsAnnotate(
  collection: PlotCollection,
  site: Site,
  options: PlotsAnnotateOptions = {},
): PlotCollection & { annotation: PlotsAnnotateInfo } {
  const targets = collection.features.map((f) => ({ id: f.properties.plot_id, lon: f.properties.lon, lat: f.properties.lat }));
  const date = options.surveyDate ?? new Date();
  const frame = options.frame ?? designFrame(collection, site) ?? undefined;
  const safety = plotSafetyNotes(targets, site, { ...options, frame });
  const nav = site.access.length
    ? plotNavigation(targets, site.access, { accessPointId: options.accessPointId, date, altitudeKm: options.altitudeKm })
    : null;
  const modelText = nav ? `${nav.model}, epoch ${nav.epoch.toFixed(1)}, for ${nav.decimalYear.toFixed(2)}` : undefined;
  const features = collection.features.map((f, i) => {
    const props = { ...f.properties };
    const row = nav?.rows[i];
    if (row && nav) {
      props.access_point = row.accessPointId;
      props.distance_m = Math.round(row.distanceM * 10) / 10;
      props.bearing_true_deg = Math.round(row.bearingTrueDeg * 10) / 10;
      props.bearing_mag_deg = Math.round(row.bearingMagDeg * 10) / 10;
      props.declination_deg = Math.round(nav.declinationDegByAccess[row.accessPointId] * 100) / 100;
      props.mag_model = modelText;
    }
    const own = f.properties.notes?.trim();
    const notes = [...(own ? [own] : []), ...(safety.byPlot.get(props.plot_id) ?? []).map((n) => n.text)];
    if (notes.length) props.notes = notes.join(NOTES_SEPARATOR);
    return { ...f, properties: props };
  });
  return {
    ...collection,
    features,
    annotation: {
      model: nav?.model ?? '',
      epoch: nav?.epoch ?? 0,
      decimalYear: nav?.decimalYear ?? 0,
      warnings: [...(nav?.warnings ?? []), ...safety.warnings],
      thresholds: safety.thresholds,
    },
  };
}

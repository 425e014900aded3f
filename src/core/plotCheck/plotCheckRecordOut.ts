import type { PlotCheckRecord } from './plotCheckTypes';
import { EXCLUSION_KINDS } from '../model/types';

const r2 = (v: number): number => Math.round(v * 100) / 100;
const r1 = (v: number): number => Math.round(v * 10) / 10;

/** Separator of the problem sentences in one table cell. */
export const PROBLEMS_SEPARATOR = ' | ';

/**
 * One checked plot as `stratplot check --json` prints it: `id`, `ok`, `problems` (sentences) and
 * the measured distances in metres (to 0.01 m) and bearings in degrees (to 0.1°), with the
 * problem codes beside the sentences.
 */
export function plotCheckRecordJson(r: PlotCheckRecord) {
  return {
    id: r.id,
    where: r.where,
    lon: r.lon,
    lat: r.lat,
    ok: r.ok,
    problems: r.problems.map((p) => p.text),
    problem_codes: r.problems.map((p) => p.code),
    severity: r.severity,
    stratum: r.stratum?.name ?? null,
    stratum_code: r.stratum?.code ?? null,
    in_hole_of: r.holeIn?.name ?? null,
    stratum_edge_m: r.edgeM === null ? null : r2(r.edgeM),
    exclusions: r.exclusions.map((e) => ({ id: e.exclusionId, kind: e.kind, name: e.name, buffer_m: e.bufferM, distance_m: r2(e.distanceM), footprint_m: r2(e.footprintM), inside: e.inside })),
    nearest_exclusion: Object.fromEntries(EXCLUSION_KINDS.flatMap((k) => {
      const n = r.nearestByKind[k];
      return n ? [[k, { id: n.exclusionId, name: n.name, distance_m: r2(n.distanceM) }]] : [];
    })),
    nearest_plot: r.nearestPlot ? { id: r.nearestPlot.id, distance_m: r2(r.nearestPlot.distanceM) } : null,
    spacing_ok: !r.spacingBroken,
    same_position_as: r.samePosition.map((o) => o.id),
    id_count: r.idCount,
    access: r.access
      ? {
          id: r.access.accessPointId,
          name: r.access.accessPointName,
          distance_m: r2(r.access.distanceM),
          bearing_true_deg: r1(r.access.bearingTrueDeg),
          bearing_mag_deg: r1(r.access.bearingMagDeg),
          declination_deg: r2(r.access.declinationDeg),
        }
      : null,
    counted: r.counted,
  };
}

/** Column names of {@link plotCheckRowFlat}, in order. */
export const PLOT_CHECK_COLUMNS = [
  'plot_id', 'where', 'ok', 'problems', 'lat', 'lon', 'stratum', 'stratum_code', 'stratum_edge_m', 'excluded_by',
  ...EXCLUSION_KINDS.flatMap((k) => [`nearest_${k}_m`, `nearest_${k}`]),
  'nearest_plot', 'nearest_plot_m', 'access_point', 'access_distance_m', 'bearing_true_deg', 'bearing_mag_deg', 'declination_deg', 'counted',
] as const;

/** One checked plot as a flat table row (the report CSV and tables): text and numbers, problems joined. */
export function plotCheckRowFlat(r: PlotCheckRecord): Record<(typeof PLOT_CHECK_COLUMNS)[number], string | number | null> {
  const row: Record<string, string | number | null> = {
    plot_id: r.id,
    where: r.where,
    ok: r.ok ? 'pass' : 'FAIL',
    problems: r.problems.map((p) => p.text).join(PROBLEMS_SEPARATOR),
    lat: r.lat,
    lon: r.lon,
    stratum: r.stratum?.name ?? (r.holeIn ? `(in a hole in ${r.holeIn.name})` : '(none)'),
    stratum_code: r.stratum?.code ?? null,
    stratum_edge_m: r.edgeM === null ? null : r1(r.edgeM),
    excluded_by: r.exclusions.map((e) => `${e.name} (${e.kind})`).join('; ') || null,
  };
  for (const k of EXCLUSION_KINDS) {
    const n = r.nearestByKind[k];
    row[`nearest_${k}_m`] = n ? r1(n.distanceM) : null;
    row[`nearest_${k}`] = n?.name ?? null;
  }
  row.nearest_plot = r.nearestPlot?.id ?? null;
  row.nearest_plot_m = r.nearestPlot ? r1(r.nearestPlot.distanceM) : null;
  row.access_point = r.access?.accessPointName ?? null;
  row.access_distance_m = r.access ? r1(r.access.distanceM) : null;
  row.bearing_true_deg = r.access ? r1(r.access.bearingTrueDeg) : null;
  row.bearing_mag_deg = r.access ? r1(r.access.bearingMagDeg) : null;
  row.declination_deg = r.access ? r2(r.access.declinationDeg) : null;
  row.counted = r.counted ? 'yes' : 'no';
  return row as Record<(typeof PLOT_CHECK_COLUMNS)[number], string | number | null>;
}

import Flatbush from 'flatbush';
import { geodesicDistanceM } from '../geo/bearingDistance';
import type { PlotProperties } from '../model/designTypes';
import { InputError } from '../common/InputError';
import type { LocalFrame } from '../geo/localFrame';
import { isClearanceShort, placementConstraintsBuild } from '../design/place/placementConstraints';
import { plotClearances } from './plotClearances';
import { plotCheckProblems, plotCheckSeverity } from './plotCheckProblems';
import {
  type CheckedStratum,
  PLOT_CHECK_SLACK_M,
  PLOT_SAME_POSITION_M,
  type PlotCheckRecord,
  type PlotNearestExclusion,
  type PlotProblem,
  type PlotsCheckOptions,
  type PlotsCheckReport,
  type PlotToCheck,
} from './plotCheckTypes';
import { plotIsActive } from '../field/plotFieldState';
import { plotNavigation } from '../field/plotNavigation';
import { plotsCheckSummary } from './plotsCheckSummary';
import { isInRingFlat } from '../geometry/segmentDistance';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import type { ExclusionKind, Site } from '../model/types';

/** The stratum whose outer ring holds (x, y): with the point in no stratum, that means in one of its holes. */
function holeFinder(site: Site, frame: LocalFrame): (x: number, y: number) => number {
  const shells: { stratum: number; xy: Float64Array; box: [number, number, number, number] }[] = [];
  const index = new Map(site.strata.map((s, i) => [s.key, i]));
  for (const part of site.parts) {
    const s = index.get(part.stratum);
    if (s === undefined) continue;
    const polys = part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates;
    for (const poly of polys) {
      if (poly.length < 2) continue;
      const xy = new Float64Array(poly[0].length * 2);
      const box: [number, number, number, number] = [Infinity, Infinity, -Infinity, -Infinity];
      poly[0].forEach((p, i) => {
        const [x, y] = frame.toXY(p[0], p[1]);
        xy[2 * i] = x;
        xy[2 * i + 1] = y;
        box[0] = Math.min(box[0], x);
        box[1] = Math.min(box[1], y);
        box[2] = Math.max(box[2], x);
        box[3] = Math.max(box[3], y);
      });
      shells.push({ stratum: s, xy, box });
    }
  }
  return (x, y) => shells.find((sh) => x >= sh.box[0] && x <= sh.box[2] && y >= sh.box[1] && y <= sh.box[3] && isInRingFlat(x, y, sh.xy, 0, sh.xy.length))?.stratum ?? -1;
}

function checkOptions(plots: readonly PlotToCheck[], o: PlotsCheckOptions): void {
  if (!(Number.isFinite(o.spacingM) && o.spacingM >= 0)) throw new InputError(`the spacing must be a distance ≥ 0 m, got ${o.spacingM}`);
  if (!(Number.isFinite(o.edgeBufferM) && o.edgeBufferM >= 0)) throw new InputError(`the edge buffer must be a distance ≥ 0 m, got ${o.edgeBufferM}`);
  if (!(o.surveyDate instanceof Date) || Number.isNaN(o.surveyDate.getTime())) throw new InputError('the survey date is not a valid date');
  if (plots.length === 0) throw new InputError('there are no plots to check');
  for (const p of plots) {
    if (!(Number.isFinite(p.lon) && Number.isFinite(p.lat) && Math.abs(p.lat) <= 90 && Math.abs(p.lon) <= 180)) {
      throw new InputError(`plot ${p.id} (${p.where}) has no valid WGS84 longitude, latitude (${p.lon}, ${p.lat})`);
    }
  }
}

/** Plots farther than this from the site's centre (metres) are only said to be far away. Common practice, no source. */
export const PLOT_FAR_FROM_SITE_M = 100_000;

/** A sample plot: any plot of a plain file; of a stratplot plot file, a primary or promoted reserve not rejected. */
function counted(p: PlotToCheck): boolean {
  return p.role === undefined ? p.status !== 'rejected' : plotIsActive({ role: p.role, status: p.status, replaces: p.replaces } as PlotProperties);
}

/** The record of a plot far from the site: outside every stratum, with how far it is and a hint about its coordinates. */
function farRecord(p: PlotToCheck, i: number, farM: number, idCounts: Map<string, number>, isCounted: boolean): PlotCheckRecord {
  const problems: PlotProblem[] = [{ code: 'outside-strata', text: `Plot ${p.id} lies outside every mapped stratum, ${(farM / 1000).toFixed(0)} km from the site: check its coordinates (latitude and longitude swapped, or another coordinate system?).` }];
  const idCount = idCounts.get(p.id) ?? 1;
  if (idCount > 1) problems.push({ code: 'duplicate-id', text: `Plot id ${p.id} is used by ${idCount} plots in the file.` });
  return {
    index: i, id: p.id, where: p.where, lon: p.lon, lat: p.lat, ok: false, severity: plotCheckSeverity(problems), problems,
    stratum: null, holeIn: null, edgeM: null, edgeBroken: false, exclusions: [], nearestByKind: {}, nearestPlot: null, spacingBroken: false, samePosition: [], idCount, access: null, counted: isCounted,
    ...(p.status ? { status: p.status } : {}),
  };
}

/** Plots by severity (most serious first), then by number of problems, then in file order. */
export function plotCheckRecordsBySeverity(records: readonly PlotCheckRecord[]): PlotCheckRecord[] {
  return [...records].sort((a, b) => b.severity - a.severity || b.problems.length - a.problems.length || a.index - b.index);
}

/**
 * Checks a set of plots made elsewhere against the site with the geometry placement uses (the same
 * UTM frame, strata triangles and boundaries, buffered exclusions, footprint and rule: see
 * plotClearances), so a plot `designRun` would never place is a plot this fails. Per plot: the
 * stratum it falls in (or none, or a hole), every exclusion the plot or its footprint enters
 * widened by its buffer (kind, name, distance to its edge), the nearest exclusion of each kind,
 * the footprint against its stratum's boundary and edge buffer, the nearest other plot against
 * the spacing, plots at the same position or with the same id, and the geodesic distance and true
 * and magnetic bearing from the nearest access point; then the set as a sample
 * (plotsCheckSummary). Pure; input order is kept.
 * @throws InputError for a site without strata, bad options, no plots or a plot without a valid position.
 * Sources: geodesics (Karney 2013, GeographicLib); declination (WMM2025); see plotClearances.
 */
export function plotsCheck(site: Site, plots: readonly PlotToCheck[], options: PlotsCheckOptions): PlotsCheckReport {
  checkOptions(plots, options);
  if (site.strata.length === 0) throw new InputError('the site has no strata to check plots against');
  const slackM = options.slackM ?? PLOT_CHECK_SLACK_M;
  const frame = siteLocalFrame(site.parts);
  const c = placementConstraintsBuild(site, frame, { footprint: options.footprint, edgeBufferM: options.edgeBufferM });
  const clear = plotClearances(c, slackM);
  const holeAt = holeFinder(site, frame);
  const named: CheckedStratum[] = site.strata.map((s) => ({ id: s.key, name: s.label, code: s.code }));
  const n = plots.length;
  const xs = new Float64Array(n);
  const ys = new Float64Array(n);
  const tree = new Flatbush(n);
  plots.forEach((p, i) => {
    const [x, y] = frame.toXY(p.lon, p.lat);
    xs[i] = x;
    ys[i] = y;
    // A position the frame cannot project still takes a box; isFar keeps it out of every search.
    if (Number.isFinite(x) && Number.isFinite(y)) tree.add(x, y, x, y);
    else tree.add(0, 0, 0, 0);
  });
  tree.finish();
  const idCounts = new Map<string, number>();
  for (const p of plots) idCounts.set(p.id, (idCounts.get(p.id) ?? 0) + 1);
  const nav = site.access.length ? plotNavigation(plots.map((p) => ({ id: p.id, lon: p.lon, lat: p.lat })), site.access, { date: options.surveyDate }) : null;
  const exclusionName = (i: number) => site.exclusions[i].name?.trim() || site.exclusions[i].id;
  const spacingGrid = options.spacingM * c.scale;
  const ids = plots.map((p) => p.id);
  const wheres = plots.map((p) => p.where);

  const box = c.strata.reduce((b, st) => [Math.min(b[0], st.bbox[0]), Math.min(b[1], st.bbox[1]), Math.max(b[2], st.bbox[2]), Math.max(b[3], st.bbox[3])], [Infinity, Infinity, -Infinity, -Infinity]);
  const [lonC, latC] = frame.toLonLat((box[0] + box[2]) / 2, (box[1] + box[3]) / 2);
  const farM = plots.map((p) => geodesicDistanceM(lonC, latC, p.lon, p.lat));
  const isFar = plots.map((_, i) => farM[i] > PLOT_FAR_FROM_SITE_M || !Number.isFinite(xs[i]) || !Number.isFinite(ys[i]));

  const records = plots.map((p, i): PlotCheckRecord => {
    const x = xs[i];
    const y = ys[i];
    // Far from the site the UTM frame no longer measures: only the geodesic distance to the site is given.
    if (isFar[i]) return farRecord(p, i, farM[i], idCounts, counted(p));
    const s = clear.stratumAt(x, y);
    const hole = s < 0 ? holeAt(x, y) : -1;
    const edge = s >= 0 ? clear.edge(s, x, y) : null;
    const exclusions = clear.blocking(x, y).map((h) => {
      const e = site.exclusions[h.exclusion];
      return { exclusionId: e.id, kind: e.kind, name: exclusionName(h.exclusion), bufferM: e.bufferM, distanceM: h.centreM, footprintM: h.footprintM, inside: h.inside };
    });
    const nearestByKind: Partial<Record<ExclusionKind, PlotNearestExclusion>> = {};
    for (const [kind, hit] of Object.entries(clear.nearestOfEachKind(x, y)) as [ExclusionKind, { exclusion: number; distanceM: number }][]) {
      nearestByKind[kind] = { exclusionId: site.exclusions[hit.exclusion].id, name: exclusionName(hit.exclusion), distanceM: hit.distanceM };
    }
    const [j] = n > 1 ? tree.neighbors(x, y, 1, Number.POSITIVE_INFINITY, (k) => k !== i && !isFar[k]) : [];
    const nearestPlot = j === undefined ? null : { index: j, id: plots[j].id, distanceM: geodesicDistanceM(p.lon, p.lat, plots[j].lon, plots[j].lat) };
    // Placement's own spacing test: grid distance against the spacing times the site's scale factor.
    const spacingBroken = j !== undefined && options.spacingM > 0 && isClearanceShort(Math.hypot(xs[j] - x, ys[j] - y), spacingGrid, slackM * c.scale);
    const samePosition = tree
      .neighbors(x, y, Number.POSITIVE_INFINITY, PLOT_SAME_POSITION_M * 2, (k) => k !== i && !isFar[k])
      .filter((k) => geodesicDistanceM(p.lon, p.lat, plots[k].lon, plots[k].lat) <= PLOT_SAME_POSITION_M)
      .sort((a, b) => a - b)
      .map((k) => ({ index: k, id: plots[k].id, where: plots[k].where }));
    const row = nav?.rows[i];
    const access = row
      ? { accessPointId: row.accessPointId, accessPointName: row.accessPointName, distanceM: row.distanceM, bearingTrueDeg: row.bearingTrueDeg, bearingMagDeg: row.bearingMagDeg, declinationDeg: nav!.declinationDegByAccess[row.accessPointId] }
      : null;
    const measured = {
      index: i,
      id: p.id,
      where: p.where,
      lon: p.lon,
      lat: p.lat,
      stratum: s >= 0 ? named[s] : null,
      holeIn: hole >= 0 ? named[hole] : null,
      edgeM: edge ? edge.footprintM : null,
      edgeBroken: edge?.blocks ?? false,
      exclusions,
      nearestByKind,
      nearestPlot,
      spacingBroken,
      samePosition,
      idCount: idCounts.get(p.id) ?? 1,
      access,
      counted: counted(p),
      ...(p.status ? { status: p.status } : {}),
    };
    const problems = plotCheckProblems(measured, { spacingM: options.spacingM, footprint: options.footprint, edgeBufferM: options.edgeBufferM, ids, wheres });
    return { ...measured, ok: problems.length === 0, severity: plotCheckSeverity(problems), problems };
  });

  const summary = plotsCheckSummary(site, frame, records);
  const failing = records.filter((r) => !r.ok).length;
  const warnings = [...summary.warnings, ...(nav?.warnings ?? [])];
  if (!nav) warnings.push('no access point is mapped: distances and bearings from access were not worked out');
  return {
    plots: records,
    strata: summary.strata,
    notes: summary.notes,
    warnings,
    counts: { plots: n, passing: n - failing, failing, counted: records.filter((r) => r.counted).length },
    settings: { spacingM: options.spacingM, footprint: options.footprint, edgeBufferM: options.edgeBufferM, slackM, surveyDate: options.surveyDate.toISOString().slice(0, 10) },
    crs: { utm_zone: frame.utmZone, epsg: frame.epsg },
    magnetic: nav ? { model: nav.model, epoch: nav.epoch, decimalYear: nav.decimalYear } : null,
  };
}

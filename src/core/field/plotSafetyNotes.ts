import { exclusionProximityIndex } from '../geometry/exclusionProximityIndex';
import { InputError } from '../common/InputError';
import { type LocalFrame, localFrameAt } from '../geo/localFrame';
import { nearestAccess, type NavTarget } from './plotNavigation';
import { bearingDistanceUnchecked } from '../geo/bearingDistance';
import type { AccessPoint, Exclusion, Site } from '../model/types';

/** Distances that trigger a safety note; defaults are common practice, no source. */
export interface SafetyThresholds {
  /** Note plots within this distance of a cliff exclusion, metres (default 50). */
  cliffNearM: number;
  /** Note plots within this distance of private land, metres (default 100). */
  privateNearM: number;
  /** Note plots farther than this from every access point, metres (default 2000). */
  remoteM: number;
}

/** Default thresholds (common practice, no source); override per site where local rules differ. */
export const DEFAULT_SAFETY_THRESHOLDS: Readonly<SafetyThresholds> = { cliffNearM: 50, privateNearM: 100, remoteM: 2000 };

export type SafetyNoteCode = 'near-cliff' | 'route-crosses-water' | 'route-crosses-cliff' | 'near-private' | 'remote';

export interface SafetyNote {
  code: SafetyNoteCode;
  text: string;
  exclusionId?: string;
  /** The distance behind the note, metres. */
  distanceM?: number;
}

export interface PlotSafetyNotes {
  byPlot: Map<string, SafetyNote[]>;
  /** The thresholds used, to print beside the notes. */
  thresholds: SafetyThresholds;
  /** Checks that could not be made, e.g. no access point. */
  warnings: string[];
}

export interface PlotSafetyOptions extends Partial<SafetyThresholds> {
  /** Access point whose straight line to each plot is checked; nearest access point when absent. */
  accessPointId?: string;
  /** Metric frame for the geometry; the UTM zone of the first plot or access point when absent. */
  frame?: LocalFrame;
}

const nameOf = (e: Exclusion): string => e.name?.trim() || e.id;
const m = (d: number): string => `${Math.round(d)} m`;

/**
 * Automatic safety notes per plot from the mapped geometry: near a cliff edge, straight line from
 * the access point crossing water or a cliff buffer, near private land, far from any access point.
 * Geometry is planar in the site's UTM zone; access distances are geodesic.
 * @returns notes keyed by plot id (every plot has an entry, possibly empty), the thresholds and warnings.
 * @throws InputError for a negative or non-finite threshold or an unknown access point id.
 * Thresholds: common practice, no source.
 */
export function plotSafetyNotes(plots: readonly NavTarget[], site: Site, options: PlotSafetyOptions = {}): PlotSafetyNotes {
  const thresholds: SafetyThresholds = { ...DEFAULT_SAFETY_THRESHOLDS };
  for (const key of ['cliffNearM', 'privateNearM', 'remoteM'] as const) {
    const v = options[key];
    if (v === undefined) continue;
    if (!Number.isFinite(v) || v < 0) throw new InputError(`safety threshold ${key} must be a distance ≥ 0 m, got ${v}`);
    thresholds[key] = v;
  }
  let fixed: AccessPoint | undefined;
  if (options.accessPointId !== undefined) {
    fixed = site.access.find((a) => a.id === options.accessPointId);
    if (!fixed) throw new InputError(`access point "${options.accessPointId}" is not on the site`);
  }
  const byPlot = new Map<string, SafetyNote[]>();
  const warnings: string[] = [];
  if (site.access.length === 0) warnings.push('no access point is mapped: route and remoteness notes were not made');
  const anchor = plots[0] ?? site.access[0];
  if (!anchor) return { byPlot, thresholds, warnings };
  const frame = options.frame ?? localFrameAt(anchor.lon, anchor.lat);
  const index = exclusionProximityIndex(site.exclusions, frame);

  for (const p of plots) {
    const notes: SafetyNote[] = [];
    const xy = frame.toXY(p.lon, p.lat);
    const cliff = index.nearest(xy[0], xy[1], ['cliff'], thresholds.cliffNearM);
    if (cliff) {
      notes.push({
        code: 'near-cliff',
        exclusionId: cliff.exclusion.id,
        distanceM: cliff.distanceM,
        text: `Cliff edge ${m(cliff.distanceM)} away (${nameOf(cliff.exclusion)}; noted within ${m(thresholds.cliffNearM)}): approach from the landward side and never work with your back to the edge.`,
      });
    }
    if (site.access.length) {
      const from = fixed ?? nearestAccess(p, site.access);
      const a = frame.toXY(from.lon, from.lat);
      for (const hit of index.crossedBy(a[0], a[1], xy[0], xy[1], ['water', 'cliff'], 0)) {
        const water = hit.exclusion.kind === 'water';
        notes.push({
          code: water ? 'route-crosses-water' : 'route-crosses-cliff',
          exclusionId: hit.exclusion.id,
          distanceM: hit.distanceM,
          text: water
            ? `The straight line from ${from.name} crosses water (${nameOf(hit.exclusion)}): walk around it; do not wade.`
            : `The straight line from ${from.name} enters the ${m(hit.exclusion.bufferM)} cliff buffer (${nameOf(hit.exclusion)}): take a safe route, not the bearing.`,
        });
      }
      const nearest = nearestAccess(p, site.access);
      const awayM = bearingDistanceUnchecked(nearest.lon, nearest.lat, p.lon, p.lat).distanceM;
      if (awayM > thresholds.remoteM) {
        notes.push({
          code: 'remote',
          distanceM: awayM,
          text: `${(awayM / 1000).toFixed(1)} km from the nearest access point (${nearest.name}; noted beyond ${(thresholds.remoteM / 1000).toFixed(1)} km): remote work — carry communication, water and first aid, and keep to the check-in time.`,
        });
      }
    }
    const priv = index.nearest(xy[0], xy[1], ['private'], thresholds.privateNearM);
    if (priv) {
      notes.push({
        code: 'near-private',
        exclusionId: priv.exclusion.id,
        distanceM: priv.distanceM,
        text: `Private land ${m(priv.distanceM)} away (${nameOf(priv.exclusion)}; noted within ${m(thresholds.privateNearM)}): landholder permission required before entry; stay on the survey side of the boundary.`,
      });
    }
    byPlot.set(p.id, notes);
  }
  return { byPlot, thresholds, warnings };
}

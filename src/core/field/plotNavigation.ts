import { bearingDistanceUnchecked } from '../geo/bearingDistance';
import { InputError } from '../common/InputError';
import { bearingMagneticDeg, magneticDeclination } from '../geo/magneticDeclination';
import type { AccessPoint } from '../model/types';

/** A place to navigate to: an id and a WGS84 position in degrees. */
export interface NavTarget {
  id: string;
  lon: number;
  lat: number;
}

/** How to reach one plot from an access point. */
export interface PlotNavigationRow {
  plotId: string;
  accessPointId: string;
  accessPointName: string;
  /** Geodesic distance, metres. */
  distanceM: number;
  /** Degrees clockwise from true north, [0, 360). */
  bearingTrueDeg: number;
  /** Degrees clockwise from magnetic north, [0, 360): true bearing minus the declination at the access point. */
  bearingMagDeg: number;
}

/** Navigation for a set of plots, with the magnetic model used. */
export interface PlotNavigation {
  rows: PlotNavigationRow[];
  /** Declination at each access point used, degrees east positive, keyed by access point id. */
  declinationDegByAccess: Record<string, number>;
  model: string;
  epoch: number;
  decimalYear: number;
  warnings: string[];
}

export interface PlotNavigationOptions {
  /** Access point every plot is measured from; when absent each plot uses its nearest access point. */
  accessPointId?: string;
  /** Survey date for the magnetic declination. */
  date: Date;
  /** Height of the access points above the ellipsoid, km (default 0; 1 km moves declination by < 0.01°). */
  altitudeKm?: number;
}

/**
 * Distance and true and magnetic bearing from an access point to each plot. The declination is
 * taken at the access point, where the crew sets the compass; across a site of a few km it varies
 * by a few hundredths of a degree.
 * @returns one row per target in input order, plus the model name, epoch and any model warnings.
 * @throws InputError when there are no access points or `accessPointId` names none of them.
 * Source: geodesics after Karney (2013); declination from the World Magnetic Model 2025.
 */
export function plotNavigation(
  targets: readonly NavTarget[],
  access: readonly AccessPoint[],
  options: PlotNavigationOptions,
): PlotNavigation {
  if (access.length === 0) {
    throw new InputError('plot navigation needs at least one access point, and the site has none');
  }
  let fixed: AccessPoint | undefined;
  if (options.accessPointId !== undefined) {
    fixed = access.find((a) => a.id === options.accessPointId);
    if (!fixed) {
      const ids = access.map((a) => a.id).join(', ');
      throw new InputError(`access point "${options.accessPointId}" is not on the site; its access points are: ${ids}`);
    }
  }
  const declination = new Map<string, number>();
  const warnings = new Set<string>();
  let model = '';
  let epoch = 0;
  let decimalYear = 0;
  const declinationAt = (a: AccessPoint): number => {
    const known = declination.get(a.id);
    if (known !== undefined) return known;
    const d = magneticDeclination([a.lat, a.lon], options.altitudeKm ?? 0, options.date);
    declination.set(a.id, d.declinationDeg);
    ({ model, epoch, decimalYear } = d);
    if (d.warning) warnings.add(d.warning);
    return d.declinationDeg;
  };
  const rows = targets.map((t) => {
    const from = fixed ?? nearestAccess(t, access);
    const bd = bearingDistanceUnchecked(from.lon, from.lat, t.lon, t.lat);
    return {
      plotId: t.id,
      accessPointId: from.id,
      accessPointName: from.name,
      distanceM: bd.distanceM,
      bearingTrueDeg: bd.bearingTrueDeg,
      bearingMagDeg: bearingMagneticDeg(bd.bearingTrueDeg, declinationAt(from)),
    };
  });
  if (rows.length === 0) declinationAt(fixed ?? access[0]);
  return {
    rows,
    declinationDegByAccess: Object.fromEntries(declination),
    model,
    epoch,
    decimalYear,
    warnings: [...warnings],
  };
}

/** The access point nearest to a position by geodesic distance (access lists are short: a linear scan). */
export function nearestAccess(t: { lon: number; lat: number }, access: readonly AccessPoint[]): AccessPoint {
  let best = access[0];
  let bestM = Number.POSITIVE_INFINITY;
  for (const a of access) {
    const d = bearingDistanceUnchecked(a.lon, a.lat, t.lon, t.lat).distanceM;
    if (d < bestM) {
      bestM = d;
      best = a;
    }
  }
  return best;
}

import { bearingDistance, bearingNormalizeDeg } from '../geo/bearingDistance';
import { bearingMagneticDeg, magneticDeclination } from '../geo/magneticDeclination';
import type { PositionFix } from '../model/fieldTypes';

/** Where a plot lies from the crew's position: how far, which way, and which way to turn the arrow. */
export interface FieldGuidance {
  /** Geodesic distance on WGS84, metres. */
  distanceM: number;
  /** Bearing from true north, degrees [0, 360). */
  bearingTrueDeg: number;
  /** Bearing from magnetic north for the date at the crew's position, degrees [0, 360). */
  bearingMagDeg: number;
  /** Declination used, degrees east positive, and the model's name with its warning (outside its years). */
  declinationDeg: number;
  magModel: string;
  magWarning: string | null;
  /**
   * Angle of the plot from the direction the device faces, degrees clockwise [0, 360), when the
   * device reports a compass heading; null without one (the arrow then points to the bearing on a
   * north-up dial).
   */
  arrowDeg: number | null;
}

/**
 * Distance and bearings from the crew's position to a plot, with the magnetic bearing for that
 * date and place and the arrow angle relative to the device's heading.
 * @param headingMagDeg the device's compass heading from magnetic north, degrees, or null when it
 *   gives none; the arrow is the magnetic bearing less it (the same declination cancels).
 * Sources: Karney (2013) geodesic inverse via geographiclib-geodesic; declination from WMM2025
 * (NOAA NCEI / BGS) via the geomagnetism package.
 * @throws RangeError for a position outside WGS84 ranges.
 */
export function fieldGuidance(fix: PositionFix, plot: { lon: number; lat: number }, date: Date, headingMagDeg: number | null): FieldGuidance {
  const bd = bearingDistance(fix.lon, fix.lat, plot.lon, plot.lat);
  const decl = magneticDeclination([fix.lat, fix.lon], 0, date);
  const bearingMagDeg = bearingMagneticDeg(bd.bearingTrueDeg, decl.declinationDeg);
  return {
    distanceM: bd.distanceM,
    bearingTrueDeg: bd.bearingTrueDeg,
    bearingMagDeg,
    declinationDeg: decl.declinationDeg,
    magModel: `${decl.model}, for ${decl.decimalYear.toFixed(2)}`,
    magWarning: decl.warning,
    arrowDeg: headingMagDeg === null || !Number.isFinite(headingMagDeg) ? null : bearingNormalizeDeg(bearingMagDeg - headingMagDeg),
  };
}

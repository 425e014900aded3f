import geomagnetism from 'geomagnetism';

/** WMM2025's stated span of validity as decimal years (NOAA/BGS WMM2025 Technical Report). */
export const WMM2025_VALID_FROM_YEAR = 2025.0;
export const WMM2025_VALID_TO_YEAR = 2030.0;

/** Magnetic field direction at a place and date, as the World Magnetic Model gives it. */
export interface MagneticDeclination {
  /** Declination: angle from true north to magnetic north, degrees, east positive. */
  declinationDeg: number;
  /** Inclination (dip), degrees, down positive. */
  inclinationDeg: number;
  /** Model name and epoch, e.g. "WMM-2025" and 2025. */
  model: string;
  epoch: number;
  /** Decimal year used for the secular variation, by {@link decimalYearOf}. */
  decimalYear: number;
  /** Set when the date lies outside the model's validity; the values are then extrapolated. */
  warning: string | null;
}

/**
 * Decimal year of a date, by the rule the geomagnetism package uses: UTC calendar year plus the
 * time since 1 January 00:00 UTC divided by a fixed 365-day year. In a leap year 31 December
 * therefore maps slightly past year + 1 (at most 1/365 of a year, which moves the secular
 * variation by well under 0.01° anywhere): we keep the package's rule so our stated year and its
 * computation agree exactly.
 */
export function decimalYearOf(date: Date): number {
  const y = date.getUTCFullYear();
  return y + (date.getTime() - Date.UTC(y, 0, 1)) / (1000 * 3600 * 24 * 365);
}

/**
 * Magnetic declination and inclination from the World Magnetic Model (WMM2025 for dates from
 * late 2024), via the geomagnetism package.
 * @param latLon [latitude, longitude] in degrees, WGS84.
 * @param altitudeKm height above the WGS84 ellipsoid, km.
 * @param date the survey date.
 * @returns declination/inclination in degrees, model name and epoch, and a warning when the date
 *   is outside WMM2025's validity 2025.0–2030.0 (the field is then extrapolated and may be off).
 * @throws RangeError for non-finite input or latitude outside ±90°.
 * Source: Chulliat et al., The US/UK World Magnetic Model for 2025–2030, NOAA NCEI / BGS (2025).
 */
export function magneticDeclination(
  latLon: readonly [number, number],
  altitudeKm: number,
  date: Date,
): MagneticDeclination {
  const [lat, lon] = latLon;
  if (!Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90) {
    throw new RangeError(`magneticDeclination: position ${lat}, ${lon} is not a valid latitude, longitude`);
  }
  if (!Number.isFinite(altitudeKm)) throw new RangeError('magneticDeclination: altitude is not a finite number');
  if (!(date instanceof Date) || Number.isNaN(date.getTime())) {
    throw new RangeError('magneticDeclination: the date is not a valid date');
  }
  const model = silently(() => geomagnetism.model(date, { allowOutOfBoundsModel: true }));
  const field = model.point([lat, lon, altitudeKm]);
  const decimalYear = decimalYearOf(date);
  const isWmm2025 = model.epoch === 2025;
  let warning: string | null = null;
  if (!isWmm2025 || decimalYear < WMM2025_VALID_FROM_YEAR || decimalYear > WMM2025_VALID_TO_YEAR) {
    warning =
      `${date.toISOString().slice(0, 10)} (${decimalYear.toFixed(2)}) is outside WMM2025's validity ` +
      `${WMM2025_VALID_FROM_YEAR.toFixed(1)}–${WMM2025_VALID_TO_YEAR.toFixed(1)}; ` +
      `${model.name || 'the model'} was used and the declination may be off: check a current chart`;
  }
  return {
    declinationDeg: field.decl,
    inclinationDeg: field.incl,
    model: model.name || `WMM-${model.epoch}`,
    epoch: model.epoch,
    decimalYear,
    warning,
  };
}

/** Magnetic bearing from a true bearing and an east-positive declination, in [0, 360). */
export function bearingMagneticDeg(bearingTrueDeg: number, declinationDeg: number): number {
  const r = (bearingTrueDeg - declinationDeg) % 360;
  const w = r < 0 ? r + 360 : r;
  return w >= 360 ? 0 : w;
}

// The package reports out-of-range dates on console.error; we return that as `warning` instead.
// Core is compiled without DOM or Node types, hence the structural lookup of the console.
function silently<T>(fn: () => T): T {
  const host = globalThis as { console?: { error: (...args: unknown[]) => void } };
  const con = host.console;
  if (!con) return fn();
  const original = con.error;
  con.error = () => {};
  try {
    return fn();
  } finally {
    con.error = original;
  }
}

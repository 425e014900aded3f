/** Degrees and decimal minutes with hemisphere letter, e.g. "34° 26.1345′ S" (4 decimals ≈ 0.2 m). */
export function degreesMinutesText(deg: number, axis: 'lat' | 'lon'): string {
  const hemi = axis === 'lat' ? (deg < 0 ? 'S' : 'N') : deg < 0 ? 'W' : 'E';
  const abs = Math.abs(deg);
  let d = Math.floor(abs);
  let min = Number(((abs - d) * 60).toFixed(4));
  if (min >= 60) {
    d += 1;
    min = 0;
  }
  return `${d}° ${min.toFixed(4).padStart(7, '0')}′ ${hemi}`;
}

/** Decimal degrees, 6 places (≈ 0.1 m), latitude first as GPS units display them. */
export function decimalDegreesText(lon: number, lat: number): string {
  return `${lat.toFixed(6)}, ${lon.toFixed(6)}`;
}

/** UTM in words that cannot be mistaken for an MGRS band: "zone 50 south, 612345 E 6187654 N". */
export function utmText(utmZone: string, easting: number, northing: number): string {
  const m = /^(\d{1,2})([NS])$/.exec(utmZone);
  const zone = m ? `zone ${m[1]} ${m[2] === 'S' ? 'south' : 'north'}` : `zone ${utmZone}`;
  return `${zone}, ${Math.round(easting)} E ${Math.round(northing)} N`;
}

/** MGRS with the usual spaces between zone and band, square, easting and northing: "50H KJ 12345 67890". */
export function mgrsSpacedText(mgrs: string): string {
  const m = /^(\d{1,2}[C-X])([A-Z]{2})(\d*)$/.exec(mgrs.replace(/\s+/g, ''));
  if (!m || m[3].length % 2) return mgrs;
  const half = m[3].length / 2;
  return `${m[1]} ${m[2]} ${m[3].slice(0, half)} ${m[3].slice(half)}`;
}

/** Declination in words with its direction: "1.92° W". */
export function declinationText(deg: number): string {
  return `${Math.abs(deg).toFixed(2)}° ${deg < 0 ? 'W' : 'E'}`;
}

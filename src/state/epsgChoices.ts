import { siteLocalFrame } from '../core/geo/siteLocalFrame';
import type { StratumPart } from '../core/model/types';
import { crsProj4Definition } from '../io/crs/crsResolve';

/** One EPSG code offered in the import form, with its name. */
export interface EpsgChoice {
  epsg: number;
  name: string;
}

/* Names as the EPSG Geodetic Parameter Dataset (epsg.org) gives them, for the codes crsResolve carries. */
const FIXED_NAMES: Record<number, string> = {
  4326: 'WGS 84 (longitude/latitude)',
  4979: 'WGS 84 3D (longitude/latitude)',
  4258: 'ETRS89 (longitude/latitude)',
  4269: 'NAD83 (longitude/latitude)',
  4283: 'GDA94 (longitude/latitude)',
  7844: 'GDA2020 (longitude/latitude)',
  4167: 'NZGD2000 (longitude/latitude)',
  3857: 'WGS 84 / Pseudo-Mercator',
  27700: 'OSGB36 / British National Grid',
  2193: 'NZGD2000 / New Zealand Transverse Mercator 2000',
  2154: 'RGF93 v1 / Lambert-93',
  3035: 'ETRS89-extended / LAEA Europe',
};

/* The fixed codes in the order offered: geographic systems first, then national grids. */
const OFFERED_AFTER = [4258, 4269, 4283, 7844, 4167, 4979, 27700, 2193, 2154, 3035, 3857];

/* Ranges of zone codes in crsResolve: first code, last code, code of zone 0, name before the zone. */
const ZONE_RANGES: [number, number, number, (zone: number) => string][] = [
  [32601, 32660, 32600, (z) => `WGS 84 / UTM zone ${z}N`],
  [32701, 32760, 32700, (z) => `WGS 84 / UTM zone ${z}S`],
  [25828, 25838, 25800, (z) => `ETRS89 / UTM zone ${z}N`],
  [26901, 26923, 26900, (z) => `NAD83 / UTM zone ${z}N`],
  [28348, 28358, 28300, (z) => `GDA94 / MGA zone ${z}`],
  [7846, 7859, 7800, (z) => `GDA2020 / MGA zone ${z}`],
];

/**
 * Name of an EPSG code stratplot can read coordinates in (the codes crsResolve carries), or null
 * for a code it does not carry. Names follow the EPSG dataset (epsg.org).
 */
export function epsgName(epsg: number): string | null {
  if (!Number.isInteger(epsg) || crsProj4Definition(epsg) === null) return null;
  if (FIXED_NAMES[epsg]) return FIXED_NAMES[epsg];
  for (const [from, to, base, name] of ZONE_RANGES) if (epsg >= from && epsg <= to) return name(epsg - base);
  return `EPSG:${epsg}`;
}

/**
 * The codes to offer first when a file does not say its coordinate system: WGS84 longitude/
 * latitude, the UTM zone of the site mapped so far (when it has strata), then the other fixed
 * codes stratplot carries. Zone ranges are not listed in full; any of them can be typed.
 */
export function epsgChoices(parts: readonly StratumPart[]): EpsgChoice[] {
  const codes = [4326];
  if (parts.length > 0) {
    try {
      codes.push(siteLocalFrame(parts).epsg);
    } catch {
      // A site outside UTM's latitudes has no zone to offer; the typed code still works.
    }
  }
  for (const code of OFFERED_AFTER) if (!codes.includes(code)) codes.push(code);
  return codes.map((epsg) => ({ epsg, name: epsgName(epsg) ?? `EPSG:${epsg}` }));
}

/**
 * Reads the text of an EPSG field ("32750", "EPSG:32750"): the code, or null when the text is
 * not a code stratplot carries.
 */
export function epsgFromText(text: string): number | null {
  const digits = /^\s*(?:EPSG:)?(\d{4,6})\s*$/i.exec(text)?.[1];
  if (!digits) return null;
  return epsgName(Number(digits)) === null ? null : Number(digits);
}

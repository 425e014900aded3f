import { type Projection, projectionFrom, projectionParse } from '../../core/geo/projection';
import { InputError } from '../../core/common/InputError';

/** A coordinate reference system of an imported or exported file, with transforms to and from WGS84. */
export interface CrsTransform {
  /** Human name, e.g. "EPSG:27700" or the name in a .prj file. */
  label: string;
  /** EPSG code when known, else null. */
  epsg: number | null;
  /** proj4 definition (a proj string or the WKT the file carried). */
  definition: string;
  /** True when coordinates are longitude/latitude in degrees. */
  isGeographic: boolean;
  /** File coordinates (x = easting or longitude) → WGS84 [lon, lat] in degrees. */
  toWgs84(x: number, y: number): [number, number];
  /** WGS84 lon/lat in degrees → file coordinates. */
  fromWgs84(lon: number, lat: number): [number, number];
}

const GRS80_NO_SHIFT = '+ellps=GRS80 +towgs84=0,0,0,0,0,0,0';

/*
 * proj4 definitions of the codes we resolve without a .prj. Parameters as published in the EPSG
 * Geodetic Parameter Dataset (epsg.org); the OSGB36 → WGS84 shift is EPSG transformation 1314
 * (Ordnance Survey, "A guide to coordinate systems in Great Britain", 7-parameter Helmert,
 * ~2 m). ETRS89, GDA94, GDA2020 and NZGD2000 are taken as coincident with WGS84 (< 1–2 m),
 * common practice for survey layout at site scale.
 */
const FIXED: Record<number, string> = {
  4326: '+proj=longlat +datum=WGS84 +no_defs',
  // WGS 84 geographic 3D: the same longitude/latitude; heights are carried through untouched.
  4979: '+proj=longlat +datum=WGS84 +no_defs',
  4258: `+proj=longlat ${GRS80_NO_SHIFT} +no_defs`,
  4283: `+proj=longlat ${GRS80_NO_SHIFT} +no_defs`,
  7844: `+proj=longlat ${GRS80_NO_SHIFT} +no_defs`,
  4167: `+proj=longlat ${GRS80_NO_SHIFT} +no_defs`,
  4269: '+proj=longlat +datum=NAD83 +no_defs',
  3857: '+proj=merc +a=6378137 +b=6378137 +lat_ts=0 +lon_0=0 +x_0=0 +y_0=0 +k=1 +units=m +nadgrids=@null +no_defs',
  27700:
    '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy ' +
    '+towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs',
  2193: `+proj=tmerc +lat_0=0 +lon_0=173 +k=0.9996 +x_0=1600000 +y_0=10000000 ${GRS80_NO_SHIFT} +units=m +no_defs`,
  2154: `+proj=lcc +lat_0=46.5 +lon_0=3 +lat_1=49 +lat_2=44 +x_0=700000 +y_0=6600000 ${GRS80_NO_SHIFT} +units=m +no_defs`,
  3035: `+proj=laea +lat_0=52 +lon_0=10 +x_0=4321000 +y_0=3210000 ${GRS80_NO_SHIFT} +units=m +no_defs`,
};

/** proj4 definition of a supported EPSG code, or null when we do not carry it. */
export function crsProj4Definition(epsg: number): string | null {
  if (FIXED[epsg]) return FIXED[epsg];
  const utm = (zone: number, south: boolean, datum: string) =>
    `+proj=utm +zone=${zone}${south ? ' +south' : ''} ${datum} +units=m +no_defs`;
  if (epsg >= 32601 && epsg <= 32660) return utm(epsg - 32600, false, '+datum=WGS84');
  if (epsg >= 32701 && epsg <= 32760) return utm(epsg - 32700, true, '+datum=WGS84');
  if (epsg >= 25828 && epsg <= 25838) return utm(epsg - 25800, false, GRS80_NO_SHIFT);
  if (epsg >= 26901 && epsg <= 26923) return utm(epsg - 26900, false, '+datum=NAD83');
  if (epsg >= 28348 && epsg <= 28358) return utm(epsg - 28300, true, GRS80_NO_SHIFT);
  if (epsg >= 7846 && epsg <= 7859) return utm(epsg - 7800, true, GRS80_NO_SHIFT);
  return null;
}

/** Every EPSG code {@link crsResolveEpsg} accepts, described in words for error messages. */
export const SUPPORTED_EPSG_TEXT =
  '4326, 4979, 4258, 4269, 4283, 7844, 4167, 3857, 27700, 2193, 2154, 3035, 32601–32660, 32701–32760, ' +
  '25828–25838, 26901–26923, 28348–28358, 7846–7859';

/**
 * Builds a transform from a proj4 definition (proj string or WKT); checks that proj4 understood
 * it by projecting a round trip. Throws InputError naming `where` when it did not.
 */
export function crsFromDefinition(definition: string, label: string, epsg: number | null, where: string): CrsTransform {
  let converter: Projection;
  let isGeographic: boolean;
  try {
    converter = projectionFrom(definition);
    const parsed = projectionParse(definition);
    isGeographic = parsed.projName === 'longlat' || parsed.projName === 'identity';
  } catch {
    throw new InputError(`${where}: the coordinate system "${label}" is not understood; give its EPSG code (--epsg)`);
  }
  return {
    label,
    epsg,
    definition,
    isGeographic,
    toWgs84: (x, y) => converter.inverse(x, y),
    fromWgs84: (lon, lat) => converter.forward(lon, lat),
  };
}

/**
 * Transform for an EPSG code from the fixed table above (no network, no guessing).
 * Throws InputError naming `where` for a code we do not carry, listing the supported ones.
 */
export function crsResolveEpsg(epsg: number, where: string): CrsTransform {
  if (epsg === 4326) return crsWgs84();
  const definition = Number.isInteger(epsg) ? crsProj4Definition(epsg) : null;
  if (!definition) {
    throw new InputError(`${where}: EPSG:${epsg} is not a coordinate system stratplot knows; supported: ${SUPPORTED_EPSG_TEXT}`);
  }
  return crsFromDefinition(definition, `EPSG:${epsg}`, epsg, where);
}

/** The WGS84 transform (identity), for writers and for files already in longitude/latitude. */
export function crsWgs84(): CrsTransform {
  return {
    label: 'EPSG:4326',
    epsg: 4326,
    definition: FIXED[4326],
    isGeographic: true,
    toWgs84: (x, y) => [x, y],
    fromWgs84: (lon, lat) => [lon, lat],
  };
}

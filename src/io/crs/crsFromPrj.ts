import { type ProjectionParsed, projectionParse } from '../../core/geo/projection';
import { InputError } from '../../core/common/InputError';
import { type CrsTransform, crsFromDefinition, crsResolveEpsg, crsWgs84 } from './crsResolve';

/*
 * Names that ESRI-style .prj files carry instead of an EPSG authority, mapped to the codes whose
 * full definitions (with datum shifts) we hold. Names as written by common desktop tools for
 * these systems (from memory, checked against the EPSG names: British National Grid = 27700,
 * NZGD2000 / New Zealand Transverse Mercator 2000 = 2193).
 */
const NAMED: Record<string, number> = {
  british_national_grid: 27700,
  osgb_1936_british_national_grid: 27700,
  osgb36_british_national_grid: 27700,
  nzgd_2000_new_zealand_transverse_mercator: 2193,
  nzgd2000_new_zealand_transverse_mercator_2000: 2193,
  nzgd_2000_nztm: 2193,
};

const WGS84_GEOG = new Set(['gcs_wgs_1984', 'wgs_84', 'wgs84', 'wgs_1984']);

function normalName(name: string): string {
  return name
    .trim()
    .toLowerCase()
    .replace(/[\s/-]+/g, '_')
    .replace(/_+/g, '_');
}

/** The EPSG code in the outermost AUTHORITY["EPSG",…] (WKT1) or ID["EPSG",…] (WKT2), if any. */
function outerEpsg(wkt: string): number | null {
  const m = /(?:AUTHORITY|ID)\[\s*"EPSG"\s*,\s*"?(\d+)"?\s*\]\s*\]\s*$/i.exec(wkt);
  return m ? Number(m[1]) : null;
}

function utmFromName(name: string): number | null {
  const m = /^wgs_(?:19)?84_utm_zone_(\d{1,2})([ns])$/.exec(name);
  if (!m) return null;
  const zone = Number(m[1]);
  if (zone < 1 || zone > 60) return null;
  return (m[2] === 'n' ? 32600 : 32700) + zone;
}

/**
 * Reads the coordinate system of a shapefile's .prj (OGC or ESRI WKT1, or WKT2) and returns its
 * transform to WGS84. An EPSG authority or a well-known name selects our own definition (so the
 * published datum shift is used); anything else goes to proj4's WKT parser, and a datum that has
 * no stated shift on a non-WGS84 ellipsoid is refused rather than silently treated as WGS84.
 * Throws InputError naming `where` when the text is empty or not understood, asking for --epsg.
 */
export function crsFromPrj(wkt: string, where: string): CrsTransform {
  const text = wkt.replace(/^\uFEFF/, '').trim();
  const ask = 'give the EPSG code of the data (--epsg, or the epsg option)';
  if (!text) throw new InputError(`${where}: the .prj file is empty; ${ask}`);
  const head = /^\s*(PROJCS|GEOGCS|PROJCRS|GEOGCRS|GEODCRS|BOUNDCRS)\s*\[\s*"([^"]*)"/i.exec(text);
  if (!head) throw new InputError(`${where}: the .prj file is not WKT text; ${ask}`);
  const name = normalName(head[2]);
  const isGeog = /^GEOG|^GEOD/i.test(head[1]);

  const code = outerEpsg(text) ?? NAMED[name] ?? utmFromName(name);
  if (code === 4326 || (isGeog && WGS84_GEOG.has(name))) return crsWgs84();
  if (code !== null) {
    try {
      return crsResolveEpsg(code, where);
    } catch {
      // A code we do not carry: fall back to the WKT itself below.
    }
  }
  let parsed: ProjectionParsed;
  try {
    parsed = projectionParse(text);
  } catch {
    throw new InputError(`${where}: the coordinate system "${head[2]}" in the .prj is not understood; ${ask}`);
  }
  const a = parsed.datum?.a ?? parsed.a ?? 6378137;
  const noShift = parsed.datum?.datum_type === 5;
  if (noShift && Math.abs(a - 6378137) > 1) {
    throw new InputError(
      `${where}: the .prj names "${head[2]}" on a datum with no stated shift to WGS84; ${ask}`,
    );
  }
  return crsFromDefinition(text, head[2], code, where);
}

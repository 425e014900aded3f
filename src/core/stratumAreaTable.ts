import { M2_PER_HA, polygonAreaM2 } from './polygonAreaM2';
import { siteLocalFrame } from './siteLocalFrame';
import { stratumUsableRegion } from './stratumUsableRegion';
import type { Site } from './types';

/** One stratum's line in the area table (snake_case: this is also the CLI's JSON). */
export interface StratumAreaRow {
  stratum: string;
  /** Number of mapped features (parts) of the stratum. */
  features: number;
  /** Mapped area on the WGS84 ellipsoid, m² (sum over the stratum's features). */
  area_m2: number;
  area_ha: number;
  /** Fraction of the total mapped area of all strata, 0–1. */
  share: number;
  /** Mapped area less buffered exclusions, m² (see stratumUsableRegion). */
  usable_m2: number;
}

/** The area table of a site: one row per stratum in the site's order, the total and the frame used. */
export interface StratumAreaTable {
  rows: StratumAreaRow[];
  total_m2: number;
  crs: { utm_zone: string; epsg: number };
}

/**
 * Mapped and usable areas of every stratum of a site. Mapped areas are geodesic polygon areas on
 * WGS84 (Karney 2013, via polygonAreaM2); usable areas clip in the site's UTM frame
 * (siteLocalFrame) and measure on the ellipsoid too. Strata listed in `site.strata` without parts
 * get zero rows; parts of strata not listed get rows after the listed ones.
 * Throws InputError when the site has no strata polygons.
 */
export function stratumAreaTable(site: Site): StratumAreaTable {
  const frame = siteLocalFrame(site.parts);
  const keys = site.strata.map((s) => s.key);
  for (const p of site.parts) if (!keys.includes(p.stratum)) keys.push(p.stratum);
  const mapped = new Map<string, { n: number; m2: number }>(keys.map((k) => [k, { n: 0, m2: 0 }]));
  for (const p of site.parts) {
    const row = mapped.get(p.stratum)!;
    row.n += 1;
    row.m2 += polygonAreaM2(p.geometry);
  }
  let total = 0;
  for (const { m2 } of mapped.values()) total += m2;
  const rows = keys.map((stratum) => {
    const { n, m2 } = mapped.get(stratum)!;
    return {
      stratum,
      features: n,
      area_m2: m2,
      area_ha: m2 / M2_PER_HA,
      share: total > 0 ? m2 / total : 0,
      usable_m2: n > 0 ? stratumUsableRegion(site, stratum, frame).areaM2 : 0,
    };
  });
  return { rows, total_m2: total, crs: { utm_zone: frame.utmZone, epsg: frame.epsg } };
}

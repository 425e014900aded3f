import { designUsableAreas } from './designUsableAreas';
import { M2_PER_HA, polygonAreaM2 } from '../geo/polygonAreaM2';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import type { Site, StratumInfo } from '../model/types';

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
  /** Mapped area less buffered exclusions, m² (see designUsableAreas). */
  usable_m2: number;
}

/** The area table of a site: one row per stratum in the site's order, the total and the frame used. */
export interface StratumAreaTable {
  rows: StratumAreaRow[];
  total_m2: number;
  crs: { utm_zone: string; epsg: number };
  /** Present when a usable area had to be counted on a grid (see designUsableAreas). */
  warnings?: string[];
}

/**
 * Mapped and usable areas of every stratum of a site. Mapped areas are geodesic polygon areas on
 * WGS84 (polygonAreaM2); usable areas are the mapped areas less the ground under buffered
 * exclusions, measured as in the design engine (designUsableAreas, site frame from siteLocalFrame). Strata listed in `site.strata` without parts
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
  // Strata that only appear on parts still get a usable area: designUsableAreas reads just the keys.
  const strata = keys.map((key) => site.strata.find((s) => s.key === key) ?? ({ key, label: key, code: key, colour: '#000000' } as StratumInfo));
  const areas = designUsableAreas({ ...site, strata }, frame);
  const rows = keys.map((stratum, i) => {
    const { n, m2 } = mapped.get(stratum)!;
    return {
      stratum,
      features: n,
      area_m2: m2,
      area_ha: m2 / M2_PER_HA,
      share: total > 0 ? m2 / total : 0,
      usable_m2: n > 0 ? areas.usable[i] : 0,
    };
  });
  const table: StratumAreaTable = { rows, total_m2: total, crs: { utm_zone: frame.utmZone, epsg: frame.epsg } };
  if (areas.warnings.length > 0) table.warnings = areas.warnings;
  return table;
}

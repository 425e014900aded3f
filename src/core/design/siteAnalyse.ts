import type { Feature, FeatureCollection, MultiPolygon } from 'geojson';
import { exclusionBufferXY } from '../geometry/exclusionBufferXY';
import { isInputError } from '../common/InputError';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import { type StratumAreaTable, stratumAreaTable } from './stratumAreaTable';
import type { Problem, Site } from '../model/types';

/** What the planner shows about a site besides the site itself: areas, buffered ground, problems. */
export interface SiteAnalysis {
  table: StratumAreaTable | null;
  /** Each exclusion widened by its buffer, lon/lat multipolygons with `id`, `kind`, `buffer_m`. */
  buffers: FeatureCollection;
  problems: Problem[];
  /** Why the areas could not be measured, worded for the user; null when they were. */
  error: string | null;
}

function buffersOf(site: Site): FeatureCollection {
  const features: Feature<MultiPolygon>[] = [];
  if (site.parts.length === 0) return { type: 'FeatureCollection', features };
  const frame = siteLocalFrame(site.parts);
  for (const e of site.exclusions) {
    const xy = exclusionBufferXY(e, frame);
    if (xy.length === 0) continue;
    features.push({
      type: 'Feature',
      geometry: { type: 'MultiPolygon', coordinates: xy.map((poly) => poly.map((ring) => ring.map(([x, y]) => frame.toLonLat(x, y)))) },
      properties: { id: e.id, kind: e.kind, buffer_m: e.bufferM },
    });
  }
  return { type: 'FeatureCollection', features };
}

/**
 * Measures a site for the planner: the area table (ellipsoidal mapped and usable areas,
 * stratumAreaTable), the buffered exclusions in lon/lat for the map (exclusionBufferXY in the
 * site's UTM frame) and validation problems. Never throws for bad input: a user-facing problem
 * is returned in `error` so the page can show it.
 */
export function siteAnalyse(site: Site, validate?: (site: Site) => Problem[]): SiteAnalysis {
  const empty: FeatureCollection = { type: 'FeatureCollection', features: [] };
  if (site.parts.length === 0) return { table: null, buffers: empty, problems: [], error: null };
  let problems: Problem[] = [];
  try {
    problems = validate ? validate(site) : [];
  } catch (e) {
    if (!isInputError(e)) throw e;
  }
  try {
    return { table: stratumAreaTable(site), buffers: buffersOf(site), problems, error: null };
  } catch (e) {
    if (!isInputError(e)) throw e;
    return { table: null, buffers: empty, problems, error: (e as Error).message };
  }
}

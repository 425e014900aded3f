import { countNoun } from '../core/common/countNoun';
import type { FeatureCollection } from 'geojson';
import { InputError, isInputError } from '../core/common/InputError';
import type { Site, StratumInfo } from '../core/model/types';
import { accessFromFeatures } from '../io/site/accessFromFeatures';
import { exclusionsFromFeatures } from '../io/site/exclusionsFromFeatures';
import { type FeatureFileOptions, parseFeatureFile } from '../io/site/parseFeatureFile';
import { STRATUM_PALETTE, strataFromFeatures } from '../io/site/strataFromFeatures';
import { type ExclusionMapping, exclusionPropertiesMap } from './exclusionPropertiesMap';
import { type ImportNeeds, importNeedsOf } from './importNeeds';
import type { PlannerStore } from './plannerStore';
import { siteCommit, siteNextId } from './siteCommit';

/** What a file turned out to hold, before it is added to the site. */
export interface ImportPreview {
  fileName: string;
  features: FeatureCollection;
  /** Attribute names found on polygon features, for choosing the one that defines strata. */
  polygonFields: string[];
  /** Attribute names found on any feature, for mapping exclusion kinds and buffers. */
  fields: string[];
  polygons: number;
  lines: number;
  points: number;
}

/**
 * Reads a map file (any format parseFeatureFile knows) and counts what it holds. `options` are
 * the reader's (layer, EPSG code, encoding, CSV columns, sql.js loader). Throws InputError.
 */
export async function importRead(fileName: string, bytes: Uint8Array, options: FeatureFileOptions = {}): Promise<ImportPreview> {
  const features = await parseFeatureFile(fileName, bytes, options);
  let polygons = 0;
  let lines = 0;
  let points = 0;
  const fields = new Set<string>();
  const allFields = new Set<string>();
  for (const f of features.features) {
    for (const k of Object.keys(f.properties ?? {})) allFields.add(k);
    const t = f.geometry?.type ?? '';
    if (t.endsWith('Polygon')) {
      polygons++;
      for (const k of Object.keys(f.properties ?? {})) fields.add(k);
    } else if (t.endsWith('LineString')) lines++;
    else if (t.endsWith('Point')) points++;
  }
  return { fileName, features, polygonFields: [...fields], fields: [...allFields], polygons, lines, points };
}

/** A file read, or what it still needs chosen (with the reader's refusal when it refused). */
export type ImportAttempt = { preview: ImportPreview } | { needs: ImportNeeds; refusal: string | null };

/**
 * Reads a map file unless it first needs a choice (a layer of several, an EPSG code, a text
 * encoding, CSV columns: see importNeedsOf), in which case the needs are returned and the user
 * reads it again with `options` completed. Throws InputError for any other problem of the file,
 * or when the options given do not fit it.
 */
export async function importAttempt(fileName: string, bytes: Uint8Array, options: FeatureFileOptions = {}): Promise<ImportAttempt> {
  const before = await importNeedsOf(fileName, bytes, options, null);
  if (before) return { needs: before, refusal: null };
  try {
    return { preview: await importRead(fileName, bytes, options) };
  } catch (error) {
    if (!isInputError(error)) throw error;
    const needs = await importNeedsOf(fileName, bytes, options, error);
    if (!needs) throw error;
    return { needs, refusal: error.message };
  }
}

/** The attribute to offer first: "stratum" if present, else a name that sounds like one, else the first. */
export function importFieldGuess(fields: readonly string[]): string | null {
  const lower = fields.map((f) => f.toLowerCase());
  for (const want of ['stratum', 'strata', 'habitat', 'veg_type', 'vegetation', 'class', 'type', 'name']) {
    const i = lower.indexOf(want);
    if (i >= 0) return fields[i];
  }
  return fields[0] ?? null;
}

function strataMergeInto(site: Site, incoming: { strata: StratumInfo[]; parts: Site['parts'] }): Site {
  const known = new Set(site.strata.map((s) => s.key));
  const codes = new Set(site.strata.map((s) => s.code));
  const strata = [...site.strata];
  for (const s of incoming.strata) {
    if (known.has(s.key)) continue;
    if (codes.has(s.code)) throw new InputError(`stratum "${s.key}" has the code ${s.code}, already used by another stratum: change one code first`);
    // Each file is coloured from the start of the palette: keep colours apart from strata already mapped.
    const used = new Set(strata.map((x) => x.colour.toLowerCase()));
    const colour = used.has(s.colour.toLowerCase()) ? (STRATUM_PALETTE.find((c) => !used.has(c)) ?? s.colour) : s.colour;
    strata.push({ ...s, colour });
    codes.add(s.code);
  }
  const ids = site.parts.map((p) => p.id);
  const parts = [...site.parts];
  for (const p of incoming.parts) {
    const id = p.id && !ids.includes(p.id) ? p.id : siteNextId(ids, 'part-');
    ids.push(id);
    parts.push({ ...p, id });
  }
  return { ...site, strata, parts };
}

/**
 * Adds a file's polygons to the site as strata grouped by `field` (existing strata of the same
 * name gain the new features). One undo step. Throws InputError (from strataFromFeatures) for
 * a missing field, non-polygon features and the like, naming the file and feature.
 */
export function importStrata(store: PlannerStore, preview: ImportPreview, field: string): number {
  const incoming = strataFromFeatures(preview.features, { field, fileName: preview.fileName });
  siteCommit(store, (site) => strataMergeInto(site, incoming), { strataField: field, notice: { tone: 'info', text: `${preview.fileName}: ${countNoun(incoming.parts.length, 'feature')} in ${countNoun(incoming.strata.length, 'stratum', 'strata')} added` } });
  return incoming.parts.length;
}

/**
 * Adds a file's features to the site as exclusions: kind and buffer from their `kind` and
 * `buffer_m` properties, or as `mapping` says (see exclusionPropertiesMap); name and notes
 * properties are kept. One undo step. Throws InputError naming the file and feature.
 */
export function importExclusions(store: PlannerStore, preview: ImportPreview, mapping?: ExclusionMapping): number {
  const features = mapping ? exclusionPropertiesMap(preview.features, mapping, preview.fileName) : preview.features;
  const incoming = exclusionsFromFeatures(features, { fileName: preview.fileName });
  siteCommit(store, (site) => {
    const ids = site.exclusions.map((e) => e.id);
    const added = incoming.map((e) => {
      const id = e.id && !ids.includes(e.id) ? e.id : siteNextId(ids, 'excl-');
      ids.push(id);
      return { ...e, id };
    });
    return { ...site, exclusions: [...site.exclusions, ...added] };
  }, { notice: { tone: 'info', text: `${preview.fileName}: ${countNoun(incoming.length, 'exclusion')} added` } });
  return incoming.length;
}

/** Adds a file's points to the site as access points. */
export function importAccess(store: PlannerStore, preview: ImportPreview): number {
  const incoming = accessFromFeatures(preview.features, { fileName: preview.fileName });
  siteCommit(store, (site) => {
    const ids = site.access.map((a) => a.id);
    const added = incoming.map((a) => {
      const id = a.id && !ids.includes(a.id) ? a.id : siteNextId(ids, 'access-');
      ids.push(id);
      return { ...a, id };
    });
    return { ...site, access: [...site.access, ...added] };
  }, { notice: { tone: 'info', text: `${preview.fileName}: ${countNoun(incoming.length, 'access point')} added` } });
  return incoming.length;
}

import type { FeatureCollection } from 'geojson';
import { limitExceeded, limitNumber, limitShown, limitText, MAX_BUFFER_M, MAX_ID_LENGTH, MAX_NAME_LENGTH, MAX_NOTE_LENGTH } from '../../core/common/inputLimits';
import { InputError } from '../../core/common/InputError';
import { DEFAULT_BUFFER_M, EXCLUSION_KINDS, type Exclusion, type ExclusionKind } from '../../core/model/types';
import { featureIdsUnique } from './featureIdsUnique';

/** Words accepted for each exclusion kind, compared case-insensitively with spaces/hyphens as "_". */
const KIND_SYNONYMS: Record<string, ExclusionKind> = {
  cliff: 'cliff',
  cliffs: 'cliff',
  cliff_edge: 'cliff',
  cliff_top: 'cliff',
  escarpment: 'cliff',
  scarp: 'cliff',
  bluff: 'cliff',
  drop_off: 'cliff',
  water: 'water',
  river: 'water',
  creek: 'water',
  stream: 'water',
  lake: 'water',
  pond: 'water',
  dam: 'water',
  lagoon: 'water',
  estuary: 'water',
  sea: 'water',
  swamp: 'water',
  wetland: 'water',
  waterbody: 'water',
  water_body: 'water',
  private: 'private',
  private_land: 'private',
  private_property: 'private',
  freehold: 'private',
  no_access: 'private',
  hazard: 'hazard',
  hazards: 'hazard',
  danger: 'hazard',
  mine_shaft: 'hazard',
  shaft: 'hazard',
  other: 'other',
  exclude: 'other',
  excluded: 'other',
};

const GEOMETRY_TYPES = new Set(['Point', 'MultiPoint', 'LineString', 'MultiLineString', 'Polygon', 'MultiPolygon']);

/** The exclusion kind a user's word stands for, or undefined when it stands for none. */
export function exclusionKindParse(word: string): ExclusionKind | undefined {
  return KIND_SYNONYMS[word.trim().toLowerCase().replace(/[\s-]+/g, '_')];
}

function bufferParse(file: string, index: number, value: unknown, kind: ExclusionKind): number {
  if (value === undefined || value === null || value === '') return DEFAULT_BUFFER_M[kind];
  const n = typeof value === 'number' ? value : typeof value === 'string' && value.trim() !== '' ? Number(value) : Number.NaN;
  if (!Number.isFinite(n)) throw new InputError(`${file}: feature ${index}: buffer_m ${limitShown(value)} is not a number of metres`);
  if (n < 0) throw new InputError(`${file}: feature ${index}: buffer_m ${n} is negative; give 0 or more metres`);
  if (n > MAX_BUFFER_M) throw limitExceeded(`${file}: feature ${index}`, `buffer_m ${n} is wider than ${limitNumber(MAX_BUFFER_M)} m`, `${limitNumber(MAX_BUFFER_M)} m`);
  return n;
}

/**
 * Reads exclusions (ground plots must keep clear of) from a feature collection.
 * Properties: `kind` (cliff, water, private, hazard, other, or a synonym such as "river"),
 * `buffer_m` (metres; missing → {@link DEFAULT_BUFFER_M} of the kind), `name`, `notes`.
 * Points, lines and polygons are accepted. Ids are the feature's id when unique, else `X<n>`.
 * Throws InputError naming the feature for a missing or unknown kind (listing the allowed ones),
 * a negative or non-numeric buffer, or an unusable geometry.
 */
export function exclusionsFromFeatures(fc: FeatureCollection, options: { fileName: string }): Exclusion[] {
  const file = options.fileName;
  const allowed = EXCLUSION_KINDS.join(', ');
  const ids = featureIdsUnique(fc.features);
  return fc.features.map((f, i) => {
    const p = (f.properties ?? {}) as Record<string, unknown>;
    const type = f.geometry?.type ?? 'no geometry';
    if (!GEOMETRY_TYPES.has(type)) {
      throw new InputError(`${file}: feature ${i} is a ${type}; exclusions must be points, lines or polygons`);
    }
    const rawKind = p.kind;
    if (rawKind === undefined || rawKind === null || rawKind === '') {
      throw new InputError(`${file}: feature ${i} has no kind; give kind = one of ${allowed}`);
    }
    const kind = typeof rawKind === 'string' ? exclusionKindParse(rawKind) : undefined;
    if (!kind) throw new InputError(`${file}: feature ${i}: unknown kind ${limitShown(rawKind)}; allowed kinds: ${allowed}`);
    const at = `${file}: feature ${i}`;
    const exclusion: Exclusion = {
      id: ids[i] ? limitText(ids[i], MAX_ID_LENGTH, at, 'its id') : `X${i + 1}`,
      kind,
      geometry: f.geometry as Exclusion['geometry'],
      bufferM: bufferParse(file, i, p.buffer_m, kind),
    };
    if (typeof p.name === 'string' && p.name.trim()) exclusion.name = limitText(p.name.trim(), MAX_NAME_LENGTH, at, 'its name');
    if (typeof p.notes === 'string' && p.notes.trim()) exclusion.notes = limitText(p.notes.trim(), MAX_NOTE_LENGTH, at, 'its notes');
    return exclusion;
  });
}

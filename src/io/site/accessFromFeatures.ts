import type { FeatureCollection } from 'geojson';
import { limitExceeded, limitNumber, limitShown, limitText, MAX_ACCESS_POINTS, MAX_ID_LENGTH, MAX_NAME_LENGTH, MAX_NOTE_LENGTH } from '../../core/common/inputLimits';
import { InputError } from '../../core/common/InputError';
import type { AccessPoint } from '../../core/model/types';
import { featureIdsUnique } from './featureIdsUnique';

type AccessKind = AccessPoint['kind'];
const ACCESS_KINDS: readonly AccessKind[] = ['car_park', 'gate', 'landing', 'other'];

const KIND_SYNONYMS: Record<string, AccessKind> = {
  car_park: 'car_park',
  carpark: 'car_park',
  parking: 'car_park',
  parking_lot: 'car_park',
  gate: 'gate',
  gateway: 'gate',
  landing: 'landing',
  boat_landing: 'landing',
  boat_ramp: 'landing',
  jetty: 'landing',
  helipad: 'landing',
  other: 'other',
};

/**
 * Reads access points (where crews start walking) from Point features.
 * Properties: `name` (missing → "Access <n>"), `kind` (car_park, gate, landing, other or a synonym
 * such as "parking"; missing → other), `notes`. Ids are the feature's id when unique, else `A<n>`.
 * Throws InputError naming the feature for a non-point geometry or an unknown kind, and naming the
 * file when it holds no features or more than {@link MAX_ACCESS_POINTS}.
 */
export function accessFromFeatures(fc: FeatureCollection, options: { fileName: string }): AccessPoint[] {
  const file = options.fileName;
  if (fc.features.length === 0) throw new InputError(`${file}: no access points (the file has no features)`);
  if (fc.features.length > MAX_ACCESS_POINTS) {
    throw limitExceeded(file, `${limitNumber(fc.features.length)} access points`, `${limitNumber(MAX_ACCESS_POINTS)} access points`);
  }
  const ids = featureIdsUnique(fc.features);
  return fc.features.map((f, i) => {
    if (f.geometry?.type !== 'Point') {
      throw new InputError(`${file}: feature ${i} is a ${f.geometry?.type ?? 'feature with no geometry'}; access points must be Point features`);
    }
    const p = (f.properties ?? {}) as Record<string, unknown>;
    let kind: AccessKind = 'other';
    if (p.kind !== undefined && p.kind !== null && p.kind !== '') {
      const k = typeof p.kind === 'string' ? KIND_SYNONYMS[p.kind.trim().toLowerCase().replace(/[\s-]+/g, '_')] : undefined;
      if (!k) throw new InputError(`${file}: feature ${i}: unknown access kind ${limitShown(p.kind)}; allowed: ${ACCESS_KINDS.join(', ')}`);
      kind = k;
    }
    const [lon, lat] = f.geometry.coordinates;
    const at = `${file}: feature ${i}`;
    const point: AccessPoint = {
      id: ids[i] ? limitText(ids[i], MAX_ID_LENGTH, at, 'its id') : `A${i + 1}`,
      name: typeof p.name === 'string' && p.name.trim() ? limitText(p.name.trim(), MAX_NAME_LENGTH, at, 'its name') : `Access ${i + 1}`,
      kind,
      lon,
      lat,
    };
    if (typeof p.notes === 'string' && p.notes.trim()) point.notes = limitText(p.notes.trim(), MAX_NOTE_LENGTH, at, 'its notes');
    return point;
  });
}

import { limitExceeded, limitNumber, MAX_COORDINATE_MAGNITUDE, MAX_FILE_VERTICES } from '../../../core/common/inputLimits';
import { InputError } from '../../../core/common/InputError';

/** Shape types of the .shp main file that stratplot reads (ESRI Shapefile Technical Description, 1998, Table 1). */
const TYPES: Record<number, { kind: 'point' | 'multipoint' | 'parts'; z: boolean }> = {
  1: { kind: 'point', z: false },
  3: { kind: 'parts', z: false },
  5: { kind: 'parts', z: false },
  8: { kind: 'multipoint', z: false },
  11: { kind: 'point', z: true },
  13: { kind: 'parts', z: true },
  15: { kind: 'parts', z: true },
  18: { kind: 'multipoint', z: true },
  21: { kind: 'point', z: false },
  23: { kind: 'parts', z: false },
  25: { kind: 'parts', z: false },
  28: { kind: 'multipoint', z: false },
};

/** What the .shp holds, record by record, as the file itself says. */
export interface ShpLayout {
  shapeType: number;
  /** Per record: the number of non-empty parts (rings of a polygon, lines of a polyline), 0 for a null shape. */
  parts: number[];
}

/**
 * Checks a shapefile main file (.shp) byte by byte before its geometry is assembled: the header
 * (file code 9994, version 1000, a supported shape type, a file length that the bytes hold), every
 * record's header and length, one shape type throughout (or null shapes), part indices that start
 * at 0, never decrease and stay within the point count, and every X and Y (and Z) word a finite
 * number within ±{@link MAX_COORDINATE_MAGNITUDE}: a NaN or absurd word would otherwise make a
 * ring vanish while its polygon is assembled. M values are not read (the format uses any value
 * below −10³⁸ for "no data").
 * Format: ESRI Shapefile Technical Description (July 1998): main file header, record headers
 * (big-endian), record contents (little-endian).
 * @param where the file and layer, for messages
 * @returns the shape type and each record's part count
 * Throws InputError naming the record (as "feature i", 0-based), part and vertex.
 */
export function shpValidate(bytes: Uint8Array, where: string): ShpLayout {
  if (bytes.length < 100) throw new InputError(`${where}: the .shp is too short to be a shapefile (${bytes.length} bytes)`);
  const v = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (v.getInt32(0, false) !== 9994) throw new InputError(`${where}: not a shapefile main file (its first word is not 9994)`);
  const shapeType = v.getInt32(32, true);
  const spec = TYPES[shapeType];
  if (!spec) {
    const what = shapeType === 31 ? 'MultiPatch (type 31)' : `type ${shapeType}`;
    throw new InputError(`${where}: the .shp holds shapes of ${what}, which stratplot does not read (points, lines and polygons only)`);
  }
  const declared = v.getInt32(24, false) * 2;
  if (declared > bytes.length) throw new InputError(`${where}: the .shp is truncated: its header says ${declared} bytes, the file has ${bytes.length}`);
  const end = declared >= 100 ? declared : bytes.length;
  const parts: number[] = [];
  let vertices = 0;
  let at = 100;
  while (at + 8 <= end) {
    const index = parts.length;
    const here = `${where}: feature ${index}`;
    const contentBytes = v.getInt32(at + 4, false) * 2;
    if (contentBytes === 0) {
      // Some writers give a null shape no content at all; it is still a record.
      parts.push(0);
      at += 8;
      continue;
    }
    if (contentBytes < 4 || at + 8 + contentBytes > end) throw new InputError(`${here}: its record runs past the end of the .shp (the file is truncated or damaged)`);
    const c = at + 8;
    const type = v.getInt32(c, true);
    if (type === 0) parts.push(0);
    else if (type !== shapeType) throw new InputError(`${here}: shape type ${type} in a file of type ${shapeType}`);
    else {
      const r = recordParts(v, c, contentBytes, spec, here);
      parts.push(r.parts);
      vertices += r.points;
    }
    if (vertices > MAX_FILE_VERTICES) {
      throw limitExceeded(where, `the .shp holds more than ${limitNumber(MAX_FILE_VERTICES)} vertices (by feature ${index})`, `${limitNumber(MAX_FILE_VERTICES)} vertices per file`);
    }
    at = c + contentBytes;
  }
  if (at !== end) throw new InputError(`${where}: the .shp ends inside a record header (the file is truncated or damaged)`);
  return { shapeType, parts };
}

function coordinate(v: DataView, at: number, here: string, vertex: number, axis: string): void {
  const x = v.getFloat64(at, true);
  if (!Number.isFinite(x)) throw new InputError(`${here}, vertex ${vertex}: the ${axis} coordinate is ${x}, not a finite number`);
  if (Math.abs(x) > MAX_COORDINATE_MAGNITUDE) {
    throw new InputError(`${here}, vertex ${vertex}: the ${axis} coordinate ${x} is beyond ±${MAX_COORDINATE_MAGNITUDE}, not a position in any coordinate system`);
  }
}

/** Checks one record's contents (from its shape type word at `c`); returns its non-empty part count and point count. */
function recordParts(v: DataView, c: number, size: number, spec: (typeof TYPES)[number], here: string): { parts: number; points: number } {
  const need = (bytes: number) => {
    if (bytes > size) throw new InputError(`${here}: its record is ${size} bytes, too short for the ${bytes} its counts need`);
  };
  if (spec.kind === 'point') {
    need(20 + (spec.z ? 8 : 0));
    coordinate(v, c + 4, here, 0, 'X');
    coordinate(v, c + 12, here, 0, 'Y');
    if (spec.z) coordinate(v, c + 20, here, 0, 'Z');
    return { parts: 1, points: 1 };
  }
  const partCount = spec.kind === 'parts' ? v.getInt32(c + 36, true) : 1;
  const pointCount = v.getInt32(spec.kind === 'parts' ? c + 40 : c + 36, true);
  if (partCount < 0 || pointCount < 0) throw new InputError(`${here}: negative part or point count`);
  if (pointCount > MAX_FILE_VERTICES) {
    throw limitExceeded(here, `it has ${limitNumber(pointCount)} vertices`, `${limitNumber(MAX_FILE_VERTICES)} vertices per file`);
  }
  const partsAt = c + 44;
  const pointsAt = spec.kind === 'parts' ? partsAt + 4 * partCount : c + 40;
  // Z block: a range (16 bytes) then one value per point.
  const zAt = pointsAt + 16 * pointCount + 16;
  need(pointsAt - c + 16 * pointCount + (spec.z ? 16 + 8 * pointCount : 0));
  for (let p = 0; p < pointCount; p++) {
    coordinate(v, pointsAt + 16 * p, here, p, 'X');
    coordinate(v, pointsAt + 16 * p + 8, here, p, 'Y');
    if (spec.z) coordinate(v, zAt + 8 * p, here, p, 'Z');
  }
  if (spec.kind === 'multipoint') return { parts: pointCount > 0 ? 1 : 0, points: pointCount };
  let nonEmpty = 0;
  let previous = 0;
  for (let k = 0; k < partCount; k++) {
    const first = v.getInt32(partsAt + 4 * k, true);
    if (k === 0 && first !== 0) throw new InputError(`${here}: its first part starts at point ${first}, not 0`);
    if (first < previous || first > pointCount) throw new InputError(`${here}: part ${k} starts at point ${first}, outside 0–${pointCount} or before part ${k - 1}`);
    if (k > 0 && first > previous) nonEmpty++;
    previous = first;
  }
  if (partCount > 0 && pointCount > previous) nonEmpty++;
  return { parts: nonEmpty, points: pointCount };
}

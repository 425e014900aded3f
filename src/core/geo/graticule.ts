import type { Feature, FeatureCollection, LineString } from 'geojson';
import { InputError } from '../common/InputError';

/** A lon/lat box, degrees: west, south, east, north (GeoJSON bbox order, RFC 7946 §5). */
export type BboxDeg = readonly [west: number, south: number, east: number, north: number];

export interface GraticuleLineProperties {
  kind: 'meridian' | 'parallel';
  /** Longitude of a meridian or latitude of a parallel, degrees. */
  valueDeg: number;
  /** Label such as "147°30′E" or "42°S" (whole minutes; seconds when the step needs them). */
  label: string;
}

/** Graticule lines never reach the poles: Web Mercator ends at ±85.05°. */
const MAX_LAT = 85;
/** Longest edge between vertices of a line, degrees, so lines bend correctly on a globe view. */
const DENSIFY_DEG = 1;
/** More lines than this is a step too fine for the box. */
const MAX_LINES = 2000;

/** Steps that read well on a map, degrees (1°, 30′, 10′, 5′, 1′, 30″ …; common practice, no source). */
const NICE_STEPS_DEG = [30, 15, 10, 5, 2, 1, 30 / 60, 20 / 60, 10 / 60, 5 / 60, 2 / 60, 1 / 60, 30 / 3600, 15 / 3600, 10 / 3600, 5 / 3600, 1 / 3600];

/**
 * A readable graticule step for a view: the largest "nice" step that gives at least `minLines`
 * lines across the larger span of the box.
 * @param spanDeg the larger of the box's width and height, degrees (> 0)
 * @param minLines lines wanted across it (default 4)
 * @returns step in degrees, one of 30°, 15°, 10°, 5°, 2°, 1°, 30′ … 1″
 */
export function graticuleStepDeg(spanDeg: number, minLines = 4): number {
  if (!(spanDeg > 0) || !Number.isFinite(spanDeg)) throw new InputError(`graticule span ${spanDeg}° must be a positive number`);
  for (const step of NICE_STEPS_DEG) if (spanDeg / step >= minLines) return step;
  return NICE_STEPS_DEG[NICE_STEPS_DEG.length - 1];
}

function formatDms(valueDeg: number, positive: string, negative: string, stepDeg: number): string {
  const hemi = valueDeg > 0 ? positive : valueDeg < 0 ? negative : '';
  const totalSeconds = Math.round(Math.abs(valueDeg) * 3600);
  const d = Math.floor(totalSeconds / 3600);
  const m = Math.floor((totalSeconds % 3600) / 60);
  const s = totalSeconds % 60;
  let text = `${d}°`;
  if (stepDeg * 3600 < 60 - 1e-9 || s !== 0) text += `${String(m).padStart(2, '0')}′${String(s).padStart(2, '0')}″`;
  else if (stepDeg < 1 - 1e-9 || m !== 0) text += `${String(m).padStart(2, '0')}′`;
  return text + hemi;
}

function densified(from: [number, number], to: [number, number]): [number, number][] {
  const span = Math.max(Math.abs(to[0] - from[0]), Math.abs(to[1] - from[1]));
  const n = Math.max(1, Math.ceil(span / DENSIFY_DEG));
  const out: [number, number][] = [];
  for (let k = 0; k <= n; k++) out.push([from[0] + ((to[0] - from[0]) * k) / n, from[1] + ((to[1] - from[1]) * k) / n]);
  return out;
}

/**
 * Meridians and parallels every `stepDeg` degrees that cross a box, as GeoJSON lines clipped to
 * the box (and to ±85° latitude), with DMS labels. Lines sit on whole multiples of the step
 * counted from 0°, so they stay put as the view pans. A box whose east is less than its west
 * crosses the antimeridian; meridian longitudes are then reported in −180…180.
 * @param bbox [west, south, east, north], degrees
 * @param stepDeg spacing, degrees (> 0); see {@link graticuleStepDeg}
 * @returns a FeatureCollection of LineStrings with {@link GraticuleLineProperties}
 * @throws InputError for a step that is not positive, a box that is not finite or south > north,
 *   or more than 2000 lines
 */
export function graticuleLines(bbox: BboxDeg, stepDeg: number): FeatureCollection<LineString, GraticuleLineProperties> {
  const [west, south0, east0, north0] = bbox;
  if (!bbox.every(Number.isFinite)) throw new InputError(`graticule box ${bbox.join(', ')} must hold four numbers`);
  if (!(stepDeg > 0) || !Number.isFinite(stepDeg)) throw new InputError(`graticule step ${stepDeg}° must be a positive number`);
  if (south0 > north0) throw new InputError(`graticule box south ${south0}° is north of its north ${north0}°`);
  const east = east0 < west ? east0 + 360 : east0;
  const south = Math.max(south0, -MAX_LAT);
  const north = Math.min(north0, MAX_LAT);
  // Scaled integer indices keep 1/60° steps free of drift (k·step, not repeated addition).
  const eps = 1e-9;
  const m0 = Math.ceil(west / stepDeg - eps);
  const m1 = Math.floor(east / stepDeg + eps);
  const p0 = Math.ceil(south / stepDeg - eps);
  const p1 = Math.floor(north / stepDeg + eps);
  const count = Math.max(0, m1 - m0 + 1) + Math.max(0, p1 - p0 + 1);
  if (count > MAX_LINES) {
    throw new InputError(`a ${stepDeg}° graticule over this box needs ${count} lines (most ${MAX_LINES}): use a larger step`);
  }
  const features: Feature<LineString, GraticuleLineProperties>[] = [];
  if (south < north) {
    for (let m = m0; m <= m1; m++) {
      const lon = m * stepDeg;
      const shown = ((((lon + 180) % 360) + 360) % 360) - 180;
      const valueDeg = shown === -180 && lon > 0 ? 180 : shown;
      features.push({
        type: 'Feature',
        properties: { kind: 'meridian', valueDeg, label: valueDeg === 180 ? formatDms(180, '', '', stepDeg) : formatDms(valueDeg, 'E', 'W', stepDeg) },
        geometry: { type: 'LineString', coordinates: densified([lon, south], [lon, north]) },
      });
    }
  }
  for (let p = p0; p <= p1; p++) {
    const lat = p * stepDeg;
    if (Math.abs(lat) > MAX_LAT || west === east) continue;
    features.push({
      type: 'Feature',
      properties: { kind: 'parallel', valueDeg: lat, label: formatDms(lat, 'N', 'S', stepDeg) },
      geometry: { type: 'LineString', coordinates: densified([west, lat], [east, lat]) },
    });
  }
  return { type: 'FeatureCollection', features };
}

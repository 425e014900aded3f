import jsts from '@turf/jsts';
import type { Geometry } from 'geojson';
import { bufferArcStepRad } from './bufferShapesXY';

/** Polygons → rings → [x, y] metres. */
type PolygonsXY = [number, number][][][];

/**
 * The planar buffer of a line or polygon geometry given in metres, as polygons that cover every
 * point within `distanceM` of it. JTS's buffer (BufferOp, via the JSTS port @turf/jsts that turf
 * itself uses) draws arcs as chords with vertices on the circle; asking it for
 * r' = r / cos(θ/2), θ the arc step, puts every chord tangent to the true circle instead, so the
 * result covers the true buffer and no vertex stands more than the arc tolerance of
 * bufferArcStepRad (≤ 0.02 m) outside it. Straight sides stand r' − r (≤ 0.02 m) outside.
 * Returns [] for an empty result.
 */
export function planarBuffer(geometry: Geometry, distanceM: number): PolygonsXY {
  const quadrant = Math.max(2, Math.ceil(Math.PI / 2 / bufferArcStepRad(distanceM)));
  const theta = Math.PI / 2 / quadrant;
  const reader = new jsts.GeoJSONReader();
  const writer = new jsts.GeoJSONWriter();
  const buffered = jsts.BufferOp.bufferOp(reader.read(geometry), distanceM / Math.cos(theta / 2), quadrant);
  if (buffered.isEmpty()) return [];
  const out = writer.write(buffered);
  if (out.type === 'Polygon') return [out.coordinates as [number, number][][]];
  if (out.type === 'MultiPolygon') return out.coordinates as [number, number][][][];
  return [];
}

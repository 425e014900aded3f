import type { Position } from 'geojson';
import type { AreaGeometry, StratumPart } from '../core/model/types';

/**
 * Stratum parts as flat arrays, to hand to another thread without copying a million little arrays:
 * every vertex's lon, lat; each ring's vertex count; each polygon's ring count; each part's polygon
 * count (negative for a Polygon, positive for a MultiPolygon). Properties are left behind, and
 * heights: the stages made in the other thread read lon/lat only.
 */
export interface StratumPartsPacked {
  coords: Float64Array;
  ringVertices: Int32Array;
  polygonRings: Int32Array;
  partPolygons: Int32Array;
  ids: string[];
  strata: string[];
}

function polygonsOf(g: AreaGeometry): Position[][][] {
  return g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
}

/** Packs parts into flat arrays (see {@link StratumPartsPacked}). */
export function stratumPartsPack(parts: readonly StratumPart[]): StratumPartsPacked {
  let vertices = 0;
  let rings = 0;
  let polygons = 0;
  for (const part of parts) {
    for (const poly of polygonsOf(part.geometry)) {
      polygons++;
      rings += poly.length;
      for (const ring of poly) vertices += ring.length;
    }
  }
  const packed: StratumPartsPacked = {
    coords: new Float64Array(2 * vertices),
    ringVertices: new Int32Array(rings),
    polygonRings: new Int32Array(polygons),
    partPolygons: new Int32Array(parts.length),
    ids: parts.map((p) => p.id),
    strata: parts.map((p) => p.stratum),
  };
  let v = 0;
  let r = 0;
  let g = 0;
  parts.forEach((part, i) => {
    const polys = polygonsOf(part.geometry);
    packed.partPolygons[i] = part.geometry.type === 'Polygon' ? -1 : polys.length;
    for (const poly of polys) {
      packed.polygonRings[g++] = poly.length;
      for (const ring of poly) {
        packed.ringVertices[r++] = ring.length;
        for (const p of ring) {
          packed.coords[v++] = p[0];
          packed.coords[v++] = p[1];
        }
      }
    }
  });
  return packed;
}

/** The parts again, with the same lon/lat numbers (no properties, no heights). */
export function stratumPartsUnpack(packed: StratumPartsPacked): StratumPart[] {
  let v = 0;
  let r = 0;
  let g = 0;
  const polygon = (): Position[][] => {
    const rings: Position[][] = [];
    for (let k = packed.polygonRings[g++]; k > 0; k--) {
      const ring: Position[] = new Array(packed.ringVertices[r++]);
      for (let i = 0; i < ring.length; i++, v += 2) ring[i] = [packed.coords[v], packed.coords[v + 1]];
      rings.push(ring);
    }
    return rings;
  };
  return packed.ids.map((id, i) => {
    const n = packed.partPolygons[i];
    const geometry: AreaGeometry = n < 0 ? { type: 'Polygon', coordinates: polygon() } : { type: 'MultiPolygon', coordinates: Array.from({ length: n }, polygon) };
    return { id, stratum: packed.strata[i], geometry };
  });
}

import type { Position } from 'geojson';
import type { AreaGeometry, StratumPart } from '../model/types';

/** Applies `f` to every ring of a polygonal geometry, returning a new geometry. */
export function areaGeometryMapRings(g: AreaGeometry, f: (ring: Position[]) => Position[]): AreaGeometry {
  return g.type === 'Polygon'
    ? { type: 'Polygon', coordinates: g.coordinates.map(f) }
    : { type: 'MultiPolygon', coordinates: g.coordinates.map((poly) => poly.map(f)) };
}

/**
 * Closes every ring whose last position differs from its first by appending a copy of the first
 * (RFC 7946 §3.1.6 requires closed rings). Pure: returns new parts and how many rings it closed;
 * parts needing no change are returned as they are.
 */
export function repairCloseRings(parts: readonly StratumPart[]): { parts: StratumPart[]; ringsClosed: number } {
  let ringsClosed = 0;
  const out = parts.map((part) => {
    let changed = false;
    const geometry = areaGeometryMapRings(part.geometry, (ring) => {
      if (ring.length === 0) return ring;
      const [a, b] = [ring[0], ring[ring.length - 1]];
      if (ring.length > 1 && a[0] === b[0] && a[1] === b[1]) return ring;
      changed = true;
      ringsClosed++;
      return [...ring, [...a]];
    });
    return changed ? { ...part, geometry } : part;
  });
  return { parts: out, ringsClosed };
}

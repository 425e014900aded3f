import { areaGeometryMapRings } from './repairCloseRings';
import type { StratumPart } from '../model/types';

/**
 * Removes vertices equal to the one before them (exact equality), keeping each ring's closing
 * vertex. Pure: returns new parts and how many vertices it dropped; unchanged parts are returned
 * as they are. Does not close rings (see repairCloseRings) and never drops a ring.
 */
export function repairDropDuplicateVertices(parts: readonly StratumPart[]): { parts: StratumPart[]; verticesDropped: number } {
  let verticesDropped = 0;
  const out = parts.map((part) => {
    let changed = false;
    const geometry = areaGeometryMapRings(part.geometry, (ring) => {
      const kept = ring.filter((p, i) => i === 0 || p[0] !== ring[i - 1][0] || p[1] !== ring[i - 1][1]);
      // A closed ring whose closing vertex repeated the one before keeps exactly one closing copy.
      const closed = ring.length > 1 && ring[0][0] === ring[ring.length - 1][0] && ring[0][1] === ring[ring.length - 1][1];
      if (closed && kept.length > 1) {
        const last = kept[kept.length - 1];
        if (last[0] !== ring[0][0] || last[1] !== ring[0][1]) kept.push([...ring[0]]);
      }
      if (kept.length === ring.length) return ring;
      changed = true;
      verticesDropped += ring.length - kept.length;
      return kept;
    });
    return changed ? { ...part, geometry } : part;
  });
  return { parts: out, verticesDropped };
}

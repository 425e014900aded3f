/**
 * The one test of the even–odd (crossing number) rule: whether the edge (x1, y1)–(x2, y2) crosses
 * the ray from (x, y) towards +x. Half-open in y (an edge counts when exactly one end lies above
 * y), so a ray through a vertex counts the two edges meeting there once between them, and
 * horizontal edges never count. A point is inside a polygon when the ray crosses an odd number of
 * its edges, holes included. Every point-in-ring test of the project goes through it, whatever
 * the layout of its edges.
 * Source: Shimrat, "Algorithm 112: Position of point relative to polygon", CACM 5 (1962);
 * Haines, "Point in polygon strategies", Graphics Gems IV (1994).
 */
export function edgeCrossesRayEast(x: number, y: number, x1: number, y1: number, x2: number, y2: number): boolean {
  return y1 > y !== y2 > y && x < x1 + ((y - y1) * (x2 - x1)) / (y2 - y1);
}

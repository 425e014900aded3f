/**
 * Clips one closed ring ([x, y] vertices, first = last or not) to an axis-aligned box by
 * Sutherland–Hodgman, one box side at a time. A concave ring may come back with zero-width
 * "bridges" along the box sides; they add no area. Returns a closed ring, or [] when nothing of the
 * ring is inside the box.
 * Source: Sutherland & Hodgman, "Reentrant polygon clipping", CACM 17(1):32–42, 1974.
 * @param box minX, minY, maxX, maxY
 */
export function polygonClipToBox(ring: readonly (readonly number[])[], box: readonly [number, number, number, number]): number[][] {
  let pts: number[][] = ring.map((p) => [p[0], p[1]]);
  if (pts.length > 1 && pts[0][0] === pts[pts.length - 1][0] && pts[0][1] === pts[pts.length - 1][1]) pts.pop();
  // Each side: which coordinate, the limit, and whether points must be ≥ (lower side) or ≤ it.
  const sides: [number, number, boolean][] = [
    [0, box[0], true],
    [0, box[2], false],
    [1, box[1], true],
    [1, box[3], false],
  ];
  for (const [axis, limit, lower] of sides) {
    if (pts.length === 0) break;
    const inside = (p: number[]) => (lower ? p[axis] >= limit : p[axis] <= limit);
    const out: number[][] = [];
    for (let i = 0; i < pts.length; i++) {
      const a = pts[i];
      const b = pts[(i + 1) % pts.length];
      const ina = inside(a);
      const inb = inside(b);
      if (ina) out.push(a);
      if (ina !== inb) {
        const t = (limit - a[axis]) / (b[axis] - a[axis]);
        const p = [a[0] + t * (b[0] - a[0]), a[1] + t * (b[1] - a[1])];
        p[axis] = limit;
        out.push(p);
      }
    }
    pts = out;
  }
  if (pts.length < 3) return [];
  pts.push([pts[0][0], pts[0][1]]);
  return pts;
}

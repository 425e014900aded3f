/** Largest distance, in metres, a drawn arc vertex may stand outside the true circle. */
export const ARC_TOLERANCE_M = 0.02;

/**
 * Angular step, in radians, between tangent points of a polygon circumscribing a circle of
 * `radiusM`, so that its vertices stand at most min(`toleranceM`, radiusM/1000) outside the
 * circle (and never more than 30° apart): a vertex halfway
 * between tangent points at angle φ from them lies at r / cos φ (elementary geometry).
 */
export function bufferArcStepRad(radiusM: number, toleranceM = ARC_TOLERANCE_M): number {
  // Small circles get a relative bound too, so their area stays within 0.07 % of πr².
  const tol = Math.min(toleranceM, radiusM * 1e-3);
  const step = 2 * Math.acos(radiusM / (radiusM + tol));
  return Math.min(step, Math.PI / 6);
}

/**
 * A closed ring circumscribing the circle of `radiusM` about (cx, cy), counter-clockwise; every
 * edge is tangent to the circle, so the ring covers it and no vertex is more than
 * {@link ARC_TOLERANCE_M} outside it.
 */
export function bufferCircleRing(cx: number, cy: number, radiusM: number): [number, number][] {
  const n = Math.max(12, Math.ceil((2 * Math.PI) / bufferArcStepRad(radiusM)));
  const step = (2 * Math.PI) / n;
  const rv = radiusM / Math.cos(step / 2);
  const ring: [number, number][] = [];
  for (let k = 0; k < n; k++) {
    const a = (k + 0.5) * step;
    ring.push([cx + rv * Math.cos(a), cy + rv * Math.sin(a)]);
  }
  ring.push([ring[0][0], ring[0][1]]);
  return ring;
}

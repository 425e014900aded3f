// Planar shape helpers for the invented demo site: wobbly natural-looking lines and loops drawn
// in metres with a seeded random source.
export type P = [number, number];
export type Ring = P[];

/** Catmull–Rom through control points, sampled densely. */
export function smoothPath(ctrl: P[]): P[] {
  const out: P[] = [];
  for (let i = 0; i < ctrl.length - 1; i++) {
    const p0 = ctrl[Math.max(0, i - 1)];
    const p1 = ctrl[i];
    const p2 = ctrl[i + 1];
    const p3 = ctrl[Math.min(ctrl.length - 1, i + 2)];
    const steps = 40;
    for (let s = 0; s < steps; s++) {
      const t = s / steps;
      const t2 = t * t;
      const t3 = t2 * t;
      const f = (a: number, b: number, c: number, d: number) =>
        0.5 * (2 * b + (-a + c) * t + (2 * a - 5 * b + 4 * c - d) * t2 + (-a + 3 * b - 3 * c + d) * t3);
      out.push([f(p0[0], p1[0], p2[0], p3[0]), f(p0[1], p1[1], p2[1], p3[1])]);
    }
  }
  out.push(ctrl[ctrl.length - 1]);
  return out;
}

/**
 * A natural-looking line through the control points: smoothed, resampled at irregular steps of
 * about `stepM`, pushed sideways by a sum of seeded sine waves of `amplitudeM`. Ends stay put.
 */
export function wobblyPath(rand: () => number, ctrl: P[], stepM: number, amplitudeM: number): P[] {
  const dense = smoothPath(ctrl);
  const cum = [0];
  for (let i = 1; i < dense.length; i++) {
    cum.push(cum[i - 1] + Math.hypot(dense[i][0] - dense[i - 1][0], dense[i][1] - dense[i - 1][1]));
  }
  const length = cum[cum.length - 1];
  const waves = [
    { l: 340, a: 1 },
    { l: 150, a: 0.55 },
    { l: 61, a: 0.3 },
    { l: 23, a: 0.12 },
  ].map((w) => ({ k: (2 * Math.PI) / (w.l * (0.8 + 0.4 * rand())), a: w.a * amplitudeM, ph: 2 * Math.PI * rand() }));
  const out: P[] = [];
  let s = 0;
  let j = 1;
  while (s < length) {
    while (j < cum.length - 1 && cum[j] < s) j++;
    const t = (s - cum[j - 1]) / (cum[j] - cum[j - 1] || 1);
    const x = dense[j - 1][0] + t * (dense[j][0] - dense[j - 1][0]);
    const y = dense[j - 1][1] + t * (dense[j][1] - dense[j - 1][1]);
    const dx = dense[j][0] - dense[j - 1][0];
    const dy = dense[j][1] - dense[j - 1][1];
    const d = Math.hypot(dx, dy) || 1;
    const taper = Math.min(1, s / 60, (length - s) / 60);
    let off = 0;
    for (const w of waves) off += w.a * Math.sin(w.k * s + w.ph);
    off = off * taper + (rand() - 0.5) * 0.15 * amplitudeM * taper;
    out.push([x - (dy / d) * off, y + (dx / d) * off]);
    s += stepM * (0.6 + 0.8 * rand());
  }
  out.push(ctrl[ctrl.length - 1]);
  return out;
}

/** A closed wobbly loop around a centre with mean radius `radiusM`. */
export function wobblyLoop(rand: () => number, cx: number, cy: number, radiusM: number, stepM: number): Ring {
  const n = Math.max(24, Math.round((2 * Math.PI * radiusM) / stepM));
  const harmonics = [2, 3, 5, 8].map((k, i) => ({ k, a: radiusM * [0.12, 0.08, 0.05, 0.025][i], ph: 2 * Math.PI * rand() }));
  const ring: Ring = [];
  for (let i = 0; i < n; i++) {
    const th = (2 * Math.PI * i) / n;
    let r = radiusM;
    for (const h of harmonics) r += h.a * Math.sin(h.k * th + h.ph);
    ring.push([cx + r * Math.cos(th), cy + r * Math.sin(th)]);
  }
  ring.push(ring[0]);
  return ring;
}

/** Even-odd point-in-ring test in the plane. */
export function insideRing(p: P, ring: Ring): boolean {
  let inside = false;
  for (let i = 1; i < ring.length; i++) {
    const a = ring[i - 1];
    const b = ring[i];
    if (a[1] > p[1] !== b[1] > p[1] && p[0] < a[0] + ((p[1] - a[1]) / (b[1] - a[1])) * (b[0] - a[0])) inside = !inside;
  }
  return inside;
}

/** Length of a polyline in metres. */
export function lengthM(line: P[]): number {
  let l = 0;
  for (let i = 1; i < line.length; i++) l += Math.hypot(line[i][0] - line[i - 1][0], line[i][1] - line[i - 1][1]);
  return l;
}

/** The first `lengthWantedM` metres of a polyline. */
export function cutAtLength(line: P[], lengthWantedM: number): P[] {
  const out: P[] = [line[0]];
  let l = 0;
  for (let i = 1; i < line.length; i++) {
    const seg = Math.hypot(line[i][0] - line[i - 1][0], line[i][1] - line[i - 1][1]);
    if (l + seg >= lengthWantedM) {
      const t = (lengthWantedM - l) / seg;
      out.push([line[i - 1][0] + t * (line[i][0] - line[i - 1][0]), line[i - 1][1] + t * (line[i][1] - line[i - 1][1])]);
      return out;
    }
    l += seg;
    out.push(line[i]);
  }
  return out;
}

/** Part of a polyline between two x values (the line runs west to east), with exact end points. */
export function sliceByX(line: P[], x0: number, x1: number): P[] {
  const at = (i: number, x: number): P => {
    const a = line[i - 1];
    const b = line[i];
    const t = (x - a[0]) / (b[0] - a[0]);
    return [x, a[1] + t * (b[1] - a[1])];
  };
  const out: P[] = [];
  for (let i = 1; i < line.length; i++) {
    const a = line[i - 1];
    const b = line[i];
    if (a[0] < x0 && b[0] >= x0) out.push(at(i, x0));
    if (b[0] > x0 && b[0] < x1) out.push(b);
    if (a[0] < x1 && b[0] >= x1) {
      out.push(at(i, x1));
      break;
    }
  }
  return out;
}


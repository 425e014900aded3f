// Small raster painting helpers for the invented demo image, on flat typed arrays.

/** Even-odd scanline fill of rings given in pixel coordinates, sampled at pixel centres. */
export function fillRings(target: Uint8Array, W: number, H: number, ringsPx: [number, number][][], value: number): void {
  const edges: number[] = [];
  for (const px of ringsPx) {
    for (let i = 1; i < px.length; i++) edges.push(px[i - 1][0], px[i - 1][1], px[i][0], px[i][1]);
  }
  const xs: number[] = [];
  for (let row = 0; row < H; row++) {
    const yc = row + 0.5;
    xs.length = 0;
    for (let e = 0; e < edges.length; e += 4) {
      const y0 = edges[e + 1];
      const y1 = edges[e + 3];
      if (y0 <= yc === y1 <= yc) continue;
      xs.push(edges[e] + ((yc - y0) / (y1 - y0)) * (edges[e + 2] - edges[e]));
    }
    xs.sort((a, b) => a - b);
    for (let k = 0; k + 1 < xs.length; k += 2) {
      const a = Math.max(0, Math.ceil(xs[k] - 0.5));
      const b = Math.min(W - 1, Math.floor(xs[k + 1] - 0.5));
      for (let col = a; col <= b; col++) target[row * W + col] = value;
    }
  }
}

/** Sets pixels within `hw` pixels of a polyline (pixel coordinates) to `value`. */
export function strokeLinePx(mask: Uint8Array, W: number, H: number, px: [number, number][], hw: number, value: number): void {
  for (let i = 1; i < px.length; i++) {
    const [ax, ay] = px[i - 1];
    const [bx, by] = px[i];
    const dx = bx - ax;
    const dy = by - ay;
    const len2 = dx * dx + dy * dy || 1;
    const c0 = Math.max(0, Math.floor(Math.min(ax, bx) - hw - 1));
    const c1 = Math.min(W - 1, Math.ceil(Math.max(ax, bx) + hw + 1));
    const r0 = Math.max(0, Math.floor(Math.min(ay, by) - hw - 1));
    const r1 = Math.min(H - 1, Math.ceil(Math.max(ay, by) + hw + 1));
    for (let r = r0; r <= r1; r++) {
      for (let c = c0; c <= c1; c++) {
        const t = Math.max(0, Math.min(1, ((c + 0.5 - ax) * dx + (r + 0.5 - ay) * dy) / len2));
        const ex = c + 0.5 - (ax + t * dx);
        const ey = r + 0.5 - (ay + t * dy);
        if (ex * ex + ey * ey <= hw * hw) mask[r * W + c] = value;
      }
    }
  }
}


/**
 * Distance in metres from the nearest source pixel, by the two-pass 3-4 chamfer transform
 * (Borgefors 1986, "Distance transformations in digital images"), about 2 % off Euclidean.
 */
export function chamferDistanceM(W: number, H: number, pixelM: number, isSource: (i: number) => boolean): Float32Array {
  const d = new Float32Array(W * H);
  for (let i = 0; i < W * H; i++) d[i] = isSource(i) ? 0 : 1e9;
  for (let r = 0; r < H; r++) {
    for (let c = 0; c < W; c++) {
      const i = r * W + c;
      if (c > 0) d[i] = Math.min(d[i], d[i - 1] + 3);
      if (r > 0) {
        d[i] = Math.min(d[i], d[i - W] + 3);
        if (c > 0) d[i] = Math.min(d[i], d[i - W - 1] + 4);
        if (c < W - 1) d[i] = Math.min(d[i], d[i - W + 1] + 4);
      }
    }
  }
  for (let r = H - 1; r >= 0; r--) {
    for (let c = W - 1; c >= 0; c--) {
      const i = r * W + c;
      if (c < W - 1) d[i] = Math.min(d[i], d[i + 1] + 3);
      if (r < H - 1) {
        d[i] = Math.min(d[i], d[i + W] + 3);
        if (c < W - 1) d[i] = Math.min(d[i], d[i + W + 1] + 4);
        if (c > 0) d[i] = Math.min(d[i], d[i + W - 1] + 4);
      }
    }
  }
  for (let i = 0; i < W * H; i++) d[i] = (d[i] / 3) * pixelM;
  return d;
}

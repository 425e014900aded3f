// Seeded value noise for the invented demo image (no Math.random).

export interface ValueNoise {
  /** A repeatable pseudo-random value in [0, 1) for an integer lattice point. */
  rnd2(ix: number, iy: number): number;
  /** Three-octave fractal value noise in [0, 1] at (x, y) metres, features about `scaleM` across. */
  fbm(x: number, y: number, scaleM: number): number;
}

/** Value noise (smoothstep-interpolated lattice values) whose lattice comes from `rand`. */
export function valueNoise(rand: () => number): ValueNoise {
  const PERM = new Uint16Array(512);
  const LATTICE = new Float32Array(256);
  {
    const p = Array.from({ length: 256 }, (_, i) => i);
    for (let i = 255; i > 0; i--) {
      const j = Math.floor(rand() * (i + 1));
      [p[i], p[j]] = [p[j], p[i]];
    }
    for (let i = 0; i < 512; i++) PERM[i] = p[i & 255];
    for (let i = 0; i < 256; i++) LATTICE[i] = rand();
  }
  const hash2 = (ix: number, iy: number) => PERM[(PERM[ix & 255] + iy) & 511];
  const rnd2 = (ix: number, iy: number) => LATTICE[hash2(ix, iy)];
  /** Smooth value noise in [0, 1] at (x, y) in lattice units. */
  function vnoise(x: number, y: number): number {
    const ix = Math.floor(x);
    const iy = Math.floor(y);
    const fx = x - ix;
    const fy = y - iy;
    const sx = fx * fx * (3 - 2 * fx);
    const sy = fy * fy * (3 - 2 * fy);
    const a = rnd2(ix, iy) + sx * (rnd2(ix + 1, iy) - rnd2(ix, iy));
    const b = rnd2(ix, iy + 1) + sx * (rnd2(ix + 1, iy + 1) - rnd2(ix, iy + 1));
    return a + sy * (b - a);
  }
  /** Three-octave fractal noise in [0, 1] with features about `scaleM` metres across. */
  function fbm(x: number, y: number, scaleM: number): number {
    const u = x / scaleM;
    const v = y / scaleM;
    return (vnoise(u, v) * 4 + vnoise(u * 2.03 + 17.1, v * 2.03 + 5.3) * 2 + vnoise(u * 4.1 + 31.7, v * 4.1 + 11.9)) / 7;
  }
  return { rnd2, fbm };
}

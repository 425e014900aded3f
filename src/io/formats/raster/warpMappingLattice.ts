/** Largest allowed error of the interpolated mapping, source pixels (GDAL's default is 0.125). */
const MAPPING_TOLERANCE_PX = 0.02;

/**
 * Source pixel position of every output pixel, as interleaved col,row pairs: exact at the nodes
 * of a lattice, bilinear between them; the lattice (32 px to start) is halved until the mapping
 * at every cell centre agrees with the exact one within 0.02 source pixels, down to exact at
 * every pixel. This is the approximate transformer of GDAL's gdalwarp (tolerance 0.125 px there).
 * @param ow output width, pixels
 * @param oh output height, pixels
 * @param exact writes the exact source col, row of output pixel i, j at out[at], out[at + 1]
 * @returns the mapping and the largest error seen at cell centres, source pixels
 */
export function warpMappingLattice(
  ow: number,
  oh: number,
  exact: (i: number, j: number, out: Float64Array, at: number) => void,
): { map: Float32Array; errorPx: number } {
  const map = new Float32Array(ow * oh * 2);
  const probe = new Float64Array(2);
  for (let step = 32; ; step = Math.max(1, step >> 1)) {
    const nx = Math.ceil((ow - 1) / step) + 1;
    const ny = Math.ceil((oh - 1) / step) + 1;
    const nodeI = (a: number) => Math.min(ow - 1, a * step);
    const nodeJ = (b: number) => Math.min(oh - 1, b * step);
    const nodes = new Float64Array(nx * ny * 2);
    for (let b = 0; b < ny; b++) for (let a = 0; a < nx; a++) exact(nodeI(a), nodeJ(b), nodes, (b * nx + a) * 2);
    let errorPx = 0;
    if (step > 1) {
      // Check at the centre of every lattice cell, where bilinear interpolation is weakest.
      for (let b = 0; b + 1 < ny && errorPx <= MAPPING_TOLERANCE_PX; b++) {
        for (let a = 0; a + 1 < nx; a++) {
          const i = (nodeI(a) + nodeI(a + 1)) >> 1;
          const j = (nodeJ(b) + nodeJ(b + 1)) >> 1;
          exact(i, j, probe, 0);
          const fi = (i - nodeI(a)) / Math.max(1, nodeI(a + 1) - nodeI(a));
          const fj = (j - nodeJ(b)) / Math.max(1, nodeJ(b + 1) - nodeJ(b));
          for (let c = 0; c < 2; c++) {
            const v00 = nodes[(b * nx + a) * 2 + c];
            const v10 = nodes[(b * nx + a + 1) * 2 + c];
            const v01 = nodes[((b + 1) * nx + a) * 2 + c];
            const v11 = nodes[((b + 1) * nx + a + 1) * 2 + c];
            const v = (v00 * (1 - fi) + v10 * fi) * (1 - fj) + (v01 * (1 - fi) + v11 * fi) * fj;
            errorPx = Math.max(errorPx, Math.abs(v - probe[c]));
          }
        }
      }
      if (errorPx > MAPPING_TOLERANCE_PX) continue;
    }
    for (let b = 0; b + 1 < ny || (ny === 1 && b === 0); b++) {
      const j0 = nodeJ(b);
      const j1 = ny === 1 ? j0 : nodeJ(b + 1);
      const b1 = ny === 1 ? b : b + 1;
      for (let j = j0; j <= j1; j++) {
        const fj = j1 === j0 ? 0 : (j - j0) / (j1 - j0);
        for (let a = 0; a + 1 < nx || (nx === 1 && a === 0); a++) {
          const i0 = nodeI(a);
          const i1 = nx === 1 ? i0 : nodeI(a + 1);
          const a1 = nx === 1 ? a : a + 1;
          for (let i = i0; i <= i1; i++) {
            const fi = i1 === i0 ? 0 : (i - i0) / (i1 - i0);
            const o = (j * ow + i) * 2;
            for (let c = 0; c < 2; c++) {
              const v00 = nodes[(b * nx + a) * 2 + c];
              const v10 = nodes[(b * nx + a1) * 2 + c];
              const v01 = nodes[(b1 * nx + a) * 2 + c];
              const v11 = nodes[(b1 * nx + a1) * 2 + c];
              map[o + c] = (v00 * (1 - fi) + v10 * fi) * (1 - fj) + (v01 * (1 - fi) + v11 * fi) * fj;
            }
          }
        }
      }
    }
    return { map, errorPx };
  }
}

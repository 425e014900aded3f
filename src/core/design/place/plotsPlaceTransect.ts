import { limitExceeded, limitNumber, MAX_LAYOUT_POSITIONS } from '../../common/inputLimits';
import { InputError } from '../../common/InputError';
import type { PlacementConstraints } from './placementConstraints';
import type { CandidateSource } from './plotsPlaceSequential';
import type { Rng } from './rng';

/** Transects across a baseline: where they start along it and where quadrats fall along each. */
export interface TransectLayout {
  /** Baseline vertices in frame metres, flat x0, y0, x1, y1, … */
  baseline: Float64Array;
  /** Positions of the transects along the baseline, grid metres from its first vertex. */
  along: Float64Array;
  /** Ground metres between quadrats and the random start of the first one (0 < start ≤ interval). */
  quadratIntervalM: number;
  quadratStartM: number;
  /** Farthest ground chainage worth trying, on either side (the site's diagonal). */
  maxChainageM: number;
}

/**
 * Lays out transects perpendicular to the baseline at a systematic interval with a random start
 * (the first at U · interval along the baseline, U uniform), and picks the random start of the
 * quadrats along them. Source: systematic line-transect layout with a random start (Buckland et al.,
 * Introduction to Distance Sampling, 2001, §7.2; Cochran 1977, ch. 8).
 * @param baselineLonLat at least two WGS84 [lon, lat] vertices
 * @param intervalM ground metres between transects; @param quadratIntervalM ground metres between quadrats
 * Throws InputError for a baseline of fewer than two distinct vertices, intervals not > 0, or
 * intervals so small that the layout would need more than MAX_LAYOUT_POSITIONS positions.
 */
export function transectLayoutRandom(
  c: PlacementConstraints,
  baselineLonLat: readonly (readonly number[])[],
  intervalM: number,
  quadratIntervalM: number,
  rng: Rng,
): TransectLayout {
  if (!(intervalM > 0)) throw new InputError(`transect interval must be more than 0 m, got ${intervalM}`);
  if (!(quadratIntervalM > 0)) throw new InputError(`quadrat interval must be more than 0 m, got ${quadratIntervalM}`);
  const pts: number[] = [];
  for (const p of baselineLonLat) {
    if (p.length < 2 || !Number.isFinite(p[0]) || !Number.isFinite(p[1])) throw new InputError('the baseline has a vertex that is not a [longitude, latitude] pair');
    const [x, y] = c.frame.toXY(p[0], p[1]);
    const n = pts.length;
    if (n >= 2 && pts[n - 2] === x && pts[n - 1] === y) continue;
    pts.push(x, y);
  }
  if (pts.length < 4) throw new InputError('the baseline needs at least two distinct vertices');
  const baseline = Float64Array.from(pts);
  let length = 0;
  for (let i = 2; i < baseline.length; i += 2) length += Math.hypot(baseline[i] - baseline[i - 2], baseline[i + 1] - baseline[i - 1]);
  const step = intervalM * c.scale;
  // Refused before the loops: a tiny interval would otherwise lay out transects for ever.
  if (length / step > MAX_LAYOUT_POSITIONS) {
    throw limitExceeded(`transect interval ${intervalM} m`, `it gives ${limitNumber(length / step)} transects along the baseline`, `${limitNumber(MAX_LAYOUT_POSITIONS)} layout positions`);
  }
  const along: number[] = [];
  for (let t = rng.float() * step; t <= length; t += step) along.push(t);
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let i = 0; i + 1 < baseline.length; i += 2) {
    minX = Math.min(minX, baseline[i]);
    maxX = Math.max(maxX, baseline[i]);
    minY = Math.min(minY, baseline[i + 1]);
    maxY = Math.max(maxY, baseline[i + 1]);
  }
  for (const s of c.strata) {
    minX = Math.min(minX, s.bbox[0]);
    minY = Math.min(minY, s.bbox[1]);
    maxX = Math.max(maxX, s.bbox[2]);
    maxY = Math.max(maxY, s.bbox[3]);
  }
  const maxChainageM = Math.hypot(maxX - minX, maxY - minY) / c.scale;
  const positions = along.length * 2 * (maxChainageM / quadratIntervalM);
  if (positions > MAX_LAYOUT_POSITIONS) {
    throw limitExceeded(
      `quadrat interval ${quadratIntervalM} m`,
      `with ${along.length} transects it gives ${limitNumber(positions)} quadrat positions to try`,
      `${limitNumber(MAX_LAYOUT_POSITIONS)} layout positions`,
    );
  }
  return {
    baseline,
    along: Float64Array.from(along),
    quadratIntervalM,
    quadratStartM: (1 - rng.float()) * quadratIntervalM,
    maxChainageM,
  };
}

/** Point and unit direction of the baseline at `t` grid metres from its start. */
function baselineAt(b: Float64Array, t: number): [number, number, number, number] {
  let left = t;
  for (let i = 2; i < b.length; i += 2) {
    const dx = b[i] - b[i - 2];
    const dy = b[i + 1] - b[i - 1];
    const len = Math.hypot(dx, dy);
    if (left <= len || i === b.length - 2) return [b[i - 2] + (dx * left) / len, b[i - 1] + (dy * left) / len, dx / len, dy / len];
    left -= len;
  }
  return [b[0], b[1], 1, 0];
}

/**
 * Candidates for transect placement in stratum `s`: along each transect (numbered from 1 in baseline
 * order), quadrats every quadrat interval from the random start, on both sides of the baseline —
 * chainage positive to the LEFT of the baseline's direction, negative to the right — kept to the
 * stratum's bounding box (the caller refuses the rest). With `offset`, the positions midway between
 * quadrats in a random order, for reserves.
 */
export function plotsPlaceTransect(c: PlacementConstraints, s: number, layout: TransectLayout, offset: { rng: Rng } | null): CandidateSource {
  const [x0, y0, x1, y1] = c.strata[s].bbox;
  const xs: number[] = [];
  const ys: number[] = [];
  const tr: number[] = [];
  const ch: number[] = [];
  const shift = offset ? layout.quadratIntervalM / 2 : 0;
  for (let j = 0; j < layout.along.length; j++) {
    const [px, py, dx, dy] = baselineAt(layout.baseline, layout.along[j]);
    for (const side of [1, -1]) {
      for (let chain = layout.quadratStartM + shift; chain <= layout.maxChainageM; chain += layout.quadratIntervalM) {
        const d = side * chain * c.scale;
        const x = px - dy * d;
        const y = py + dx * d;
        if (x < x0 || x > x1 || y < y0 || y > y1) continue;
        xs.push(x);
        ys.push(y);
        tr.push(j + 1);
        ch.push(side * chain);
      }
    }
  }
  const n = xs.length;
  const order = Array.from({ length: n }, (_, i) => i);
  if (offset) {
    for (let k = n - 1; k > 0; k--) {
      const r = offset.rng.int(k + 1);
      [order[k], order[r]] = [order[r], order[k]];
    }
  }
  let k = 0;
  const source = {
    insideByConstruction: false,
    finite: true,
    transect: undefined as number | undefined,
    chainageM: undefined as number | undefined,
    next(out: Float64Array): boolean {
      if (k >= n) return false;
      const i = order[k++];
      out[0] = xs[i];
      out[1] = ys[i];
      source.transect = tr[i];
      source.chainageM = Math.round(ch[i] * 10) / 10;
      return true;
    },
  };
  return source;
}

import Flatbush from 'flatbush';

/** Consecutive segments per chunk: boundaries run on, so a chunk's box stays small (common practice, no source). */
const CHUNK = 8;

/**
 * A box index of flat segments (x0, y0, x1, y1 each) that keeps one box per run of {@link CHUNK}
 * consecutive segments instead of one per segment, and checks each segment of a chunk the query
 * meets against the query box. Ring-ordered boundaries make chunks nearly as tight as segments,
 * so queries find the same segments while the index sorts an eighth of the boxes.
 */
export class SegmentChunkIndex {
  /** Largest x of any segment. */
  readonly maxX: number;
  private readonly xy: Float64Array;
  private readonly count: number;
  private readonly chunks: Flatbush;

  /** Indexes the first `count` segments of `xy`; `count` must be at least 1. */
  constructor(xy: Float64Array, count: number) {
    this.xy = xy;
    this.count = count;
    this.chunks = new Flatbush(Math.ceil(count / CHUNK));
    let maxX = Number.NEGATIVE_INFINITY;
    for (let start = 0; start < count; start += CHUNK) {
      let x0 = Number.POSITIVE_INFINITY;
      let y0 = Number.POSITIVE_INFINITY;
      let x1 = Number.NEGATIVE_INFINITY;
      let y1 = Number.NEGATIVE_INFINITY;
      for (let i = start, end = Math.min(count, start + CHUNK); i < end; i++) {
        const o = 4 * i;
        const ax = xy[o];
        const ay = xy[o + 1];
        const bx = xy[o + 2];
        const by = xy[o + 3];
        if (ax < x0) x0 = ax;
        if (bx < x0) x0 = bx;
        if (ay < y0) y0 = ay;
        if (by < y0) y0 = by;
        if (ax > x1) x1 = ax;
        if (bx > x1) x1 = bx;
        if (ay > y1) y1 = ay;
        if (by > y1) y1 = by;
      }
      this.chunks.add(x0, y0, x1, y1);
      if (x1 > maxX) maxX = x1;
    }
    this.chunks.finish();
    this.maxX = maxX;
  }

  /**
   * Calls `visit` with each segment whose box meets the query box (edges included), until `visit`
   * returns true; returns whether it did. Segments come chunk by chunk, in no promised order.
   */
  some(minX: number, minY: number, maxX: number, maxY: number, visit: (segment: number) => boolean): boolean {
    const xy = this.xy;
    const count = this.count;
    return this.chunks.collides(minX, minY, maxX, maxY, (chunk) => {
      for (let i = chunk * CHUNK, end = Math.min(count, i + CHUNK); i < end; i++) {
        const o = 4 * i;
        const ax = xy[o];
        const bx = xy[o + 2];
        if ((ax < minX && bx < minX) || (ax > maxX && bx > maxX)) continue;
        const ay = xy[o + 1];
        const by = xy[o + 3];
        if ((ay < minY && by < minY) || (ay > maxY && by > maxY)) continue;
        if (visit(i)) return true;
      }
      return false;
    });
  }
}

/**
 * Plots placed so far, in a grid hash with cells of the minimum spacing, so "is any plot closer than
 * the spacing?" looks at the 3 × 3 cells around a candidate instead of every plot.
 */
export class PlotSpacingHash {
  private readonly cells = new Map<number, number[]>();
  private readonly xs: number[] = [];
  private readonly ys: number[] = [];
  private readonly cell: number;
  private readonly spacing2: number;
  private readonly originX: number;
  private readonly originY: number;

  /**
   * @param spacing minimum centre-to-centre distance in grid metres (0: no test)
   * @param originX, originY a corner of the site, so cell numbers stay small
   * @param extent the site's larger side in grid metres, bounding the number of cells
   */
  constructor(
    private readonly spacing: number,
    originX: number,
    originY: number,
    extent: number,
  ) {
    this.cell = Math.max(spacing, extent / 1e6, 1e-6);
    this.spacing2 = spacing * spacing;
    this.originX = originX;
    this.originY = originY;
  }

  private key(ix: number, iy: number): number {
    return ix * 4194304 + iy;
  }

  /** True when no plot lies closer than the spacing to (x, y). */
  isFree(x: number, y: number): boolean {
    if (this.spacing <= 0) return true;
    const ix = Math.floor((x - this.originX) / this.cell);
    const iy = Math.floor((y - this.originY) / this.cell);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        const list = this.cells.get(this.key(ix + dx, iy + dy));
        if (!list) continue;
        for (const p of list) {
          const ex = this.xs[p] - x;
          const ey = this.ys[p] - y;
          if (ex * ex + ey * ey < this.spacing2) return false;
        }
      }
    }
    return true;
  }

  /** Records a plot at (x, y). */
  add(x: number, y: number): void {
    const p = this.xs.length;
    this.xs.push(x);
    this.ys.push(y);
    if (this.spacing <= 0) return;
    const k = this.key(Math.floor((x - this.originX) / this.cell), Math.floor((y - this.originY) / this.cell));
    const list = this.cells.get(k);
    if (list) list.push(p);
    else this.cells.set(k, [p]);
  }
}

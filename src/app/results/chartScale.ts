/**
 * Round tick values covering [min, max]: steps of 1, 2 or 5 × 10^k, about `count` of them
 * (the usual "nice numbers" rule, e.g. Heckbert, Graphics Gems, 1990; common practice).
 * @returns ticks from the first at or below min to the last at or above max
 */
export function chartTicks(min: number, max: number, count = 5): number[] {
  if (!(Number.isFinite(min) && Number.isFinite(max))) return [0, 1];
  if (min === max) {
    const pad = Math.abs(min) > 0 ? Math.abs(min) * 0.1 : 1;
    min -= pad;
    max += pad;
  }
  const raw = (max - min) / Math.max(1, count);
  const mag = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 5, 10].map((m) => m * mag).find((s) => s >= raw) ?? 10 * mag;
  const first = Math.floor(min / step) * step;
  const ticks: number[] = [];
  for (let v = first; v <= max + step * 1e-9; v += step) ticks.push(Number(v.toPrecision(12)));
  if (ticks[ticks.length - 1] < max) ticks.push(Number((ticks[ticks.length - 1] + step).toPrecision(12)));
  return ticks;
}

/** A linear map from [d0, d1] to [r0, r1]. */
export function chartLinear(d0: number, d1: number, r0: number, r1: number): (v: number) => number {
  const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
  return (v) => r0 + (v - d0) * k;
}

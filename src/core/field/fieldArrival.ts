/** Whether the crew has reached a plot, and the radius that decided it. */
export interface FieldArrival {
  arrived: boolean;
  /** The radius used, metres: the one set, or the position's accuracy when that is wider. */
  radiusM: number;
  /** True when the accuracy widened the radius set. */
  widened: boolean;
}

/**
 * Arrival at a plot: the position lies within the arrival radius. A position known only to ±a
 * metres cannot tell points closer than a apart, so the radius is never taken smaller than the
 * reported accuracy (a crew with ±12 m sees "arrived" at 12 m and is told the radius was widened,
 * and finds the plot centre by tape and compass from there). Common practice, no source.
 */
export function fieldArrival(distanceM: number, radiusM: number, accuracyM: number): FieldArrival {
  const accuracy = Number.isFinite(accuracyM) && accuracyM > 0 ? accuracyM : 0;
  const widened = accuracy > radiusM;
  const used = widened ? accuracy : radiusM;
  return { arrived: distanceM <= used, radiusM: used, widened };
}

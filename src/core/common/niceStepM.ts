/** Scale-bar and grid steps a map reader takes in at a glance, metres (common practice, no source). */
const NICE = [10, 20, 25, 50, 100, 200, 250, 500, 1000, 2000, 2500, 5000, 10_000, 20_000, 50_000];

/** The nice step (from 10 m to 50 km) nearest above `roughM`: for the printed maps' scale bars and grids and the field view's sketch. */
export function niceStepM(roughM: number): number {
  return NICE.find((s) => s >= roughM) ?? NICE[NICE.length - 1];
}

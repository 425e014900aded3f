/**
 * Runs `run(k)` for each job k that this thread takes from slot `slot` of counters shared with
 * another thread (each take adds one, so no job runs twice), until `count` are taken; returns how
 * many ran here.
 */
export function jobsTake(counters: Int32Array, slot: number, count: number, run: (k: number) => void): number {
  let ran = 0;
  for (let k = Atomics.add(counters, slot, 1); k < count; k = Atomics.add(counters, slot, 1), ran++) run(k);
  return ran;
}

// Shared pieces of the fuzz suite: how many inputs each target tries, the fixed seed, and the one
// property every target checks on the command line: exit 0 (with a result the target then checks
// against an independent computation) or exactly one error line with exit 2 (3 for a short
// design), never another status, never "internal error", within a time and memory budget.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import geodesic from 'geographiclib-geodesic';
import { runCli } from '../../src/cli/main';

/** Seed of every fuzz run (STRATPLOT_FUZZ_SEED overrides it to explore further). */
export const FUZZ_SEED = Number(process.env.STRATPLOT_FUZZ_SEED ?? 14);

/** Targets in the suite; STRATPLOT_FUZZ_RUNS (the long run, `npm run fuzz`) is shared among them. */
const TARGETS = 7;

/** Inputs one target tries: `quick` inside `npm test`, a share of STRATPLOT_FUZZ_RUNS in the long run. */
export function fuzzRuns(quick: number): number {
  const total = Number(process.env.STRATPLOT_FUZZ_RUNS ?? 0);
  return total > 0 ? Math.max(1, Math.round(total / TARGETS)) : quick;
}

/** Wall-clock budget of one command on one fuzzed input, ms. */
export const CASE_BUDGET_MS = 5_000;
/** Resident memory the test process may reach while fuzzing, bytes. */
export const MEMORY_BUDGET_BYTES = 1.5 * 1024 ** 3;

/** Tally of outcomes, printed after each target so the long run's figures can be read off. */
export interface FuzzTally {
  target: string;
  runs: number;
  ok: number;
  refused: number;
  short: number;
  slowestMs: number;
}

export function fuzzTally(target: string): FuzzTally {
  return { target, runs: 0, ok: 0, refused: 0, short: 0, slowestMs: 0 };
}

export function fuzzReport(t: FuzzTally): void {
  if (process.env.STRATPLOT_FUZZ_RUNS) {
    console.log(`fuzz ${t.target}: ${t.runs} inputs, ${t.ok} exit 0, ${t.refused} exit 2, ${t.short} exit 3, slowest ${t.slowestMs} ms`);
  }
}

/** A fresh folder for one target's files (rewritten on every input). */
export function fuzzDir(target: string): string {
  return mkdtempSync(join(tmpdir(), `stratplot-fuzz-${target}-`));
}

/**
 * Writes `files` into `dir`, runs `stratplot argv` in this process and checks the property every
 * target shares. Throws (failing the property, so fast-check shrinks the input) on any other exit
 * status, an error that is not exactly one line, an "internal error", or a budget passed.
 */
export async function fuzzCli(
  tally: FuzzTally,
  dir: string,
  files: Record<string, Uint8Array | string>,
  argv: string[],
  allowed: readonly number[] = [0, 2],
): Promise<{ code: number; out: string; err: string }> {
  for (const [name, bytes] of Object.entries(files)) writeFileSync(join(dir, name), bytes);
  let out = '';
  let err = '';
  const started = performance.now();
  const code = await runCli(argv, { out: (t) => (out += t), err: (t) => (err += t), cwd: dir });
  const ms = Math.round(performance.now() - started);
  tally.runs++;
  tally.slowestMs = Math.max(tally.slowestMs, ms);
  if (code === 0) tally.ok++;
  else if (code === 2) tally.refused++;
  else if (code === 3) tally.short++;
  if (!allowed.includes(code)) throw new Error(`exit ${code} (allowed ${allowed.join(', ')}): ${err.slice(0, 300)}`);
  if (code !== 0) {
    const lines = err.split('\n');
    if (lines.length !== 2 || lines[1] !== '') throw new Error(`exit ${code} with ${lines.length - 1} lines on stderr: ${err.slice(0, 300)}`);
    if (!err.startsWith(`stratplot ${argv[0]}: `)) throw new Error(`error line does not name the command: ${err.slice(0, 200)}`);
    if (/internal error/.test(err)) throw new Error(err);
  }
  if (ms > CASE_BUDGET_MS) throw new Error(`took ${ms} ms, over the ${CASE_BUDGET_MS} ms budget`);
  const rss = process.memoryUsage().rss;
  if (rss > MEMORY_BUDGET_BYTES) throw new Error(`resident memory ${Math.round(rss / 1024 ** 2)} MiB, over the budget`);
  return { code, out, err };
}

/**
 * Geodesic area, m², of a ring of [lon, lat] (closing vertex optional), signed positive when
 * counter-clockwise. Reference: geographiclib-geodesic 2.2 (Karney 2013), PolygonArea on WGS84.
 */
export function ringAreaSignedM2(ring: readonly (readonly number[])[]): number {
  const poly = geodesic.Geodesic.WGS84.Polygon(false);
  const n = ring.length > 1 && ring[0][0] === ring[ring.length - 1][0] && ring[0][1] === ring[ring.length - 1][1] ? ring.length - 1 : ring.length;
  for (let i = 0; i < n; i++) poly.AddPoint(ring[i][1], ring[i][0]);
  return poly.Compute(false, true).area ?? Number.NaN;
}

/** Geodesic area of a polygon given as rings (shell first): |shell| less |holes|, m². */
export function polygonAreaM2(rings: readonly (readonly (readonly number[])[])[]): number {
  return rings.reduce((sum, ring, i) => sum + (i === 0 ? 1 : -1) * Math.abs(ringAreaSignedM2(ring)), 0);
}

/** Whether two areas agree to stratplot's stated accuracy (1e-6 relative, README "Performance"), with 0.01 m² of slack. */
export function areasAgree(a: number, b: number): boolean {
  return Math.abs(a - b) <= 1e-6 * Math.max(Math.abs(a), Math.abs(b)) + 0.01;
}

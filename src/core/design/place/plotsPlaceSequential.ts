import { FIT_EXCLUDED, FIT_NEAR_EDGE, FIT_OK, FIT_OUTSIDE_STRATUM, type PlacementConstraints } from './placementConstraints';
import type { PlotSpacingHash } from './plotSpacingHash';

/** Where candidate positions come from: random, Halton, grid or transect. */
export interface CandidateSource {
  /** Writes the next candidate's x, y (grid metres) into out[0], out[1]; false when there are no more. */
  next(out: Float64Array): boolean;
  /** True when candidates are drawn from the stratum's own triangles (no point-in-stratum test needed). */
  readonly insideByConstruction: boolean;
  /** True for a fixed list of positions (grid, transect): every one is tried, no try budget. */
  readonly finite?: boolean;
  /** Transect number and chainage of the last candidate (transect designs). */
  readonly transect?: number;
  readonly chainageM?: number;
}

/** Plots accepted so far, in placement order. */
export interface PlacedPlots {
  x: number[];
  y: number[];
  stratum: number[];
  reserve: boolean[];
  transect: (number | undefined)[];
  chainageM: (number | undefined)[];
}

/** What happened to the candidates of one call. */
export interface PlacementTally {
  placed: number;
  outside: number;
  nearEdge: number;
  excluded: number;
  tooClose: number;
  /** True when the source ran dry or the try budget was spent before `count` plots were found. */
  gaveUp: boolean;
}

/** Hooks for long runs: checked every 1024 candidates. */
export interface PlacementHooks {
  tick?: () => void;
}

/**
 * Refused candidates in a row before a stratum counts as full: with even 1 candidate in 1 000 fitting,
 * giving up too early has a chance of e^-20 (common practice, no source).
 */
export const MAX_CONSECUTIVE_FAILURES = 20000;

/** What one run of {@link plotsPlaceSequential} places, from where, and into what. */
export interface SequentialRequest {
  /** Index of the stratum in the constraints. */
  stratum: number;
  /** Plots wanted (Infinity: as many as fit, for grids and transects). */
  count: number;
  source: CandidateSource;
  /** Every plot kept so far, of all strata, for the spacing rule. */
  spacing: PlotSpacingHash;
  /** Where kept plots are appended. */
  out: PlacedPlots;
  role: 'primary' | 'reserve';
  hooks?: PlacementHooks;
}

/**
 * Sequential inhibition: takes candidates from `source` in order and keeps each one whose footprint
 * fits the request's stratum (inside it, edge buffer, clear of buffered exclusions) and lies at least the
 * spacing from every plot kept before, until `count` are kept. Gives up after
 * {@link MAX_CONSECUTIVE_FAILURES} refusals in a row or 10 000 + 1 000 · count candidates in all, so
 * it always ends; the tally says how many fit. Source: simple sequential inhibition (Diggle,
 * Statistical Analysis of Spatial Point Patterns, 2nd ed. 2003, §5.3 "SSI process").
 */
export function plotsPlaceSequential(c: PlacementConstraints, request: SequentialRequest): PlacementTally {
  const { stratum: s, count, source, spacing, out, hooks = {} } = request;
  const reserve = request.role === 'reserve';
  const tally: PlacementTally = { placed: 0, outside: 0, nearEdge: 0, excluded: 0, tooClose: 0, gaveUp: false };
  const xy = new Float64Array(2);
  const budget = Number.isFinite(count) ? 10000 + 1000 * count : Number.POSITIVE_INFINITY;
  let tries = 0;
  let failures = 0;
  while (tally.placed < count) {
    const spent = !source.finite && (tries >= budget || failures >= MAX_CONSECUTIVE_FAILURES);
    if (spent || !source.next(xy)) {
      tally.gaveUp = Number.isFinite(count);
      break;
    }
    tries++;
    if ((tries & 1023) === 0) hooks.tick?.();
    const x = xy[0];
    const y = xy[1];
    const fit = c.check(s, x, y, source.insideByConstruction);
    if (fit !== FIT_OK) {
      failures++;
      if (fit === FIT_OUTSIDE_STRATUM) tally.outside++;
      else if (fit === FIT_NEAR_EDGE) tally.nearEdge++;
      else if (fit === FIT_EXCLUDED) tally.excluded++;
      continue;
    }
    if (!spacing.isFree(x, y)) {
      failures++;
      tally.tooClose++;
      continue;
    }
    failures = 0;
    spacing.add(x, y);
    out.x.push(x);
    out.y.push(y);
    out.stratum.push(s);
    out.reserve.push(reserve);
    out.transect.push(source.transect);
    out.chainageM.push(source.chainageM);
    tally.placed++;
  }
  return tally;
}

import { allocateLargestRemainder } from './allocate/allocateLargestRemainder';
import type { DesignSettings } from '../model/designTypes';
import { limitExceeded, limitNumber, MAX_DESIGN_PLOTS } from '../common/inputLimits';
import type { PlacementConstraints } from './place/placementConstraints';
import { plotsPlaceBalanced } from './place/plotsPlaceBalanced';
import { gridLayoutRandom, plotsPlaceGrid } from './place/plotsPlaceGrid';
import { type CandidateSource, type PlacedPlots, type PlacementHooks, type PlacementTally, plotsPlaceSequential } from './place/plotsPlaceSequential';
import { plotsPlaceCells } from './place/plotsPlaceCells';
import { plotsPlaceRandom } from './place/plotsPlaceRandom';
import { PlotSpacingHash } from './place/plotSpacingHash';
import { plotsPlaceTransect, transectLayoutRandom } from './place/plotsPlaceTransect';
import type { RngStreams } from './place/rngStreams';

/** Plots of a whole design, with what each stratum could hold. */
export interface DesignPlacement {
  placed: PlacedPlots;
  primaries: number[];
  reserves: number[];
  /** Plots a stratum could hold when placement gave up short of what it was asked for; else null. */
  capacity: (number | null)[];
  warnings: string[];
  statements: string[];
}

function emptyPlaced(): PlacedPlots {
  return { x: [], y: [], stratum: [], reserve: [], transect: [], chainageM: [] };
}

function droppedWords(t: { excluded: number; nearEdge: number; tooClose: number }): string {
  return `${t.excluded} on excluded ground (inside a buffered exclusion), ${t.nearEdge} with the footprint over the stratum edge or inside the edge buffer, ${t.tooClose} closer than the minimum spacing to another plot`;
}

/** What {@link designPlace} is asked to place, per stratum in site order. */
export interface DesignPlaceRequest {
  /** Primaries per stratum (ignored for grid and transect). */
  wanted: readonly number[];
  /** Allocation weights per stratum, for sharing a shortfall. */
  weights: readonly number[];
  /** Basis area per stratum (m²), for the default grid spacing. */
  basisM2: readonly number[];
  streams: RngStreams;
  hooks?: PlacementHooks;
}

/**
 * Places the primaries and reserves of a design in stratum order. Random and balanced designs take
 * `wanted[h]` primaries per stratum by sequential inhibition; when a stratum gives up short, the
 * shortfall is reported and, with `redistributeShortfall`, shared among the strata with room in
 * proportion to `weights` (largest remainder), repeatedly until placed or no stratum has room.
 * Grid and transect designs keep every position that fits. Reserves come after all primaries, by the
 * same process (random order for grid and transect: the offset positions shuffled). Each random
 * step draws from its own stream of `streams`: one per stratum for random and balanced placement and
 * for the reserve order, one for a grid's origin or the transects' start.
 * Throws InputError from the layouts (bad grid spacing, baseline) and whatever `hooks.tick` throws.
 */
export function designPlace(c: PlacementConstraints, s: DesignSettings, request: DesignPlaceRequest): DesignPlacement {
  const { wanted, weights, basisM2, streams, hooks = {} } = request;
  const h = c.strata.length;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const st of c.strata) {
    minX = Math.min(minX, st.bbox[0]);
    minY = Math.min(minY, st.bbox[1]);
    maxX = Math.max(maxX, st.bbox[2]);
    maxY = Math.max(maxY, st.bbox[3]);
  }
  const spacing = new PlotSpacingHash(s.spacingM * c.scale, minX, minY, Math.max(maxX - minX, maxY - minY, 1));
  const placed = emptyPlaced();
  const primaries = new Array<number>(h).fill(0);
  const reserves = new Array<number>(h).fill(0);
  const capacity = new Array<number | null>(h).fill(null);
  const full = new Array<boolean>(h).fill(false);
  const warnings: string[] = [];
  const statements: string[] = [];
  const keys = c.strata.map((st) => st.key);
  const fixedLayout = s.method === 'grid' || s.method === 'transect';

  let primarySource: (i: number) => CandidateSource;
  let reserveSource: (i: number) => CandidateSource;
  if (s.method === 'grid') {
    const total = basisM2.reduce((a, b) => a + b, 0);
    const spacingM = s.gridSpacingM ?? Math.round(Math.sqrt(total / Math.max(1, s.plots)) * 10) / 10;
    // One plot per cell of spacing²: a spacing that gives far more plots than the limit is refused before the grid is walked.
    const expected = total / (spacingM * spacingM);
    if (expected > MAX_DESIGN_PLOTS) {
      throw limitExceeded(`grid spacing ${spacingM} m`, `it gives about ${limitNumber(expected)} plots over the strata`, `${limitNumber(MAX_DESIGN_PLOTS)} plots in one design`);
    }
    if (s.gridSpacingM === null) statements.push(`Grid spacing ${spacingM} m was chosen to give about ${s.plots} plots over the basis area.`);
    const layout = gridLayoutRandom(c, spacingM, s.gridAngleDeg, streams.stream('grid-origin'));
    statements.push(
      `Systematic grid: ${spacingM} m spacing, random origin, lines turned ${s.gridAngleDeg}° clockwise from true north; reserves are cell centres (half a cell across) in random order.`,
    );
    primarySource = (i) => plotsPlaceGrid(c, i, layout, null);
    reserveSource = (i) => plotsPlaceGrid(c, i, layout, { rng: streams.stream('grid-reserves', i) });
  } else if (s.method === 'transect') {
    const layout = transectLayoutRandom(c, s.baseline!, s.transectIntervalM!, s.quadratIntervalM!, streams.stream('transect-start'));
    statements.push(
      `Transects run perpendicular to the baseline every ${s.transectIntervalM} m from a random start, with quadrats every ${s.quadratIntervalM} m; chainage is metres from the baseline, positive to the left of its direction and negative to the right. Reserves lie midway between quadrats, in random order.`,
    );
    primarySource = (i) => plotsPlaceTransect(c, i, layout, null);
    reserveSource = (i) => plotsPlaceTransect(c, i, layout, { rng: streams.stream('transect-reserves', i) });
  } else {
    const sources = c.strata.map((_, i) =>
      s.method === 'balanced'
        ? plotsPlaceBalanced(c, i, streams.stream('balanced', i))
        : streams.version >= 3
          ? plotsPlaceCells(c, i, streams.stream('random', i))
          : plotsPlaceRandom(c, i, streams.stream('random', i)),
    );
    primarySource = (i) => sources[i];
    reserveSource = (i) => sources[i];
  }

  const tallies: PlacementTally[] = [];
  for (let i = 0; i < h; i++) {
    // A layout keeps every position that fits, up to one past the limit so that an oversized one is caught.
    const count = fixedLayout ? MAX_DESIGN_PLOTS + 1 - placed.x.length : wanted[i];
    const t = plotsPlaceSequential(c, { stratum: i, count, source: primarySource(i), spacing, out: placed, role: 'primary', hooks });
    if (fixedLayout && placed.x.length > MAX_DESIGN_PLOTS) {
      throw limitExceeded(`the ${s.method} layout`, `it gives more than ${limitNumber(MAX_DESIGN_PLOTS)} plots`, `${limitNumber(MAX_DESIGN_PLOTS)} plots in one design; use wider intervals`);
    }
    tallies.push(t);
    primaries[i] = t.placed;
    if (t.gaveUp) full[i] = true;
  }
  if (fixedLayout) {
    statements.push(
      `Plots per stratum follow from the ${s.method} layout (about in proportion to each stratum's usable area), not from the allocation setting; each plot stands for about the same area of ground.`,
    );
    const dropped = tallies.reduce((a, t) => ({ excluded: a.excluded + t.excluded, nearEdge: a.nearEdge + t.nearEdge, tooClose: a.tooClose + t.tooClose }), {
      excluded: 0,
      nearEdge: 0,
      tooClose: 0,
    });
    if (dropped.excluded + dropped.nearEdge + dropped.tooClose > 0) warnings.push(`Positions dropped: ${droppedWords(dropped)}.`);
    primaries.forEach((p, i) => {
      if (p < s.minPerStratum) warnings.push(`stratum "${keys[i]}" received only ${p} plot(s) from the layout, fewer than the minimum of ${s.minPerStratum}.`);
    });
  } else {
    for (let i = 0; i < h; i++) {
      if (!full[i]) continue;
      capacity[i] = primaries[i];
      warnings.push(
        `stratum "${keys[i]}" holds only ${primaries[i]} of its ${wanted[i]} plots under the spacing, footprint and buffers (placement gave up; refused: ${droppedWords(tallies[i])}).`,
      );
    }
    let shortfall = wanted.reduce((a, w, i) => a + w - primaries[i], 0);
    if (shortfall > 0 && !s.redistributeShortfall) {
      warnings.push(`${shortfall} plot(s) short in all; turn on redistribution of the shortfall to move them to strata with room.`);
    }
    while (shortfall > 0 && s.redistributeShortfall) {
      const roomy = keys.map((_, i) => i).filter((i) => !full[i]);
      if (roomy.length === 0) {
        warnings.push(`${shortfall} plot(s) could not be placed anywhere: every stratum is full.`);
        break;
      }
      const wsum = roomy.reduce((a, i) => a + weights[i], 0);
      const quotas = roomy.map((i) => (wsum > 0 ? (shortfall * weights[i]) / wsum : shortfall / roomy.length));
      const extra = allocateLargestRemainder(quotas, shortfall);
      const moved: string[] = [];
      let got = 0;
      roomy.forEach((i, k) => {
        if (extra[k] === 0) return;
        const t = plotsPlaceSequential(c, { stratum: i, count: extra[k], source: primarySource(i), spacing, out: placed, role: 'primary', hooks });
        primaries[i] += t.placed;
        got += t.placed;
        if (t.placed) moved.push(`${t.placed} to "${keys[i]}"`);
        if (t.gaveUp) {
          full[i] = true;
          capacity[i] = primaries[i];
        }
      });
      if (moved.length) warnings.push(`Shortfall redistributed: ${moved.join(', ')}.`);
      shortfall -= got;
    }
  }
  hooks.tick?.();
  for (let i = 0; i < h; i++) {
    if (s.reservePerStratum === 0) break;
    const t = plotsPlaceSequential(c, { stratum: i, count: s.reservePerStratum, source: reserveSource(i), spacing, out: placed, role: 'reserve', hooks });
    reserves[i] = t.placed;
    if (t.placed < s.reservePerStratum) {
      warnings.push(`stratum "${keys[i]}" has only ${t.placed} of ${s.reservePerStratum} reserve plots: there is no more room that meets the constraints.`);
      if (capacity[i] === null && !fixedLayout) capacity[i] = primaries[i] + t.placed;
    }
  }
  return { placed, primaries, reserves, capacity, warnings, statements };
}

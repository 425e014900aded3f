import type { AllocationResult } from './allocate/allocateWithMinimum';
import { designAllocation } from './designAllocation';
import { type DesignPlacement, designPlace } from './designPlace';
import { designSettingsCheck } from './designSettingsCheck';
import { designCapacityCheck, designSizeCheck, placementPolygonsCheck } from './designSizeCheck';
import { designUsableAreas } from './designUsableAreas';
import type { PartAreas } from './partAreas';
import type { StratumOutlineXY } from './place/stratumOutlineXY';
import { designStatements } from './designStatements';
import type { AllocationRow, DesignSettings, PlotCollection, RngVersion } from '../model/designTypes';
import { InputError } from '../common/InputError';
import { type PlacementConstraints, placementConstraintsBuild } from './place/placementConstraints';
import type { StratumSampling } from './place/placementStrata';
import { plotIdsFor } from './place/plotIds';
import { plotRecord } from './plotRecord';
import { rngStreams, rngVersionOf, rngVersionText } from './place/rngStreams';
import { plotsInStrataCheck } from './plotsInStrataCheck';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import type { Site } from '../model/types';
import { STRATPLOT_VERSION } from '../common/version';
import { M2_PER_HA, roundTo } from '../common/units';

/** Hooks for a long design run (the web worker passes these). */
export interface DesignRunOptions {
  /** Called with a fraction in [0, 1] and a stage name. */
  onProgress?: (fraction: number, stage: string) => void;
  /**
   * The slow per-stratum and per-part stages, already made for this very site (the command line
   * makes them in a second thread while it checks the map); used only when their counts match the
   * site's, and they must come from the same code on the same input, so the design is unchanged.
   */
  made?: DesignStagesMade;
}

/** How a design made with generator `version` samples and tests its strata (see RngVersion). */
export function designSampling(version: RngVersion): StratumSampling {
  return version >= 3 ? 'cells' : 'triangles';
}

/** Stages of a design that depend on the site only, made ahead: each part's areas and each stratum's outline (with its triangles or its cell grid, whichever the design samples by). */
export interface DesignStagesMade {
  partAreas: readonly PartAreas[];
  strata: readonly StratumOutlineXY[];
}

/** What the allocation step gives placement: plots per stratum (random and balanced designs), weights for a shortfall, and what to tell the user. */
interface DesignShares {
  allocation: AllocationResult | null;
  weights: number[];
  warnings: string[];
  statements: string[];
}

/**
 * Shares plots among the strata that have basis area (designAllocation) and maps the result back to
 * every stratum in site order; a stratum with no basis area gets none, and a warning says so.
 */
function designShares(keys: readonly string[], basis: readonly number[], settings: DesignSettings): DesignShares {
  const warnings: string[] = [];
  // A stratum with no basis area cannot hold a plot: it is left out of the allocation, and said so.
  const active = keys.map((_, i) => i).filter((i) => basis[i] > 0);
  for (let i = 0; i < keys.length; i++) {
    if (basis[i] > 0) continue;
    warnings.push(`stratum "${keys[i]}" has no ${settings.shareBasis} area (buffered exclusions cover it): it gets no plots and the estimates do not cover it.`);
  }
  const strataBasis = active.map((i) => ({ key: keys[i], basisM2: basis[i] }));
  const statements: string[] = [];
  let allocation: AllocationResult | null = null;
  let weights = basis.slice();
  if (settings.method === 'random' || settings.method === 'balanced') {
    const planned = designAllocation(strataBasis, settings);
    allocation = planned.allocation;
    statements.push(...planned.statements);
    weights = keys.map(() => 0);
    active.forEach((i, k) => {
      weights[i] = planned.weights[k];
    });
    // Back from the strata that have ground to every stratum, in site order.
    const plots = keys.map(() => 0);
    active.forEach((i, k) => {
      plots[i] = allocation!.plots[k];
    });
    allocation = { ...allocation, plots };
  }
  return { allocation, weights, warnings, statements };
}

/**
 * The plot records of a placement: ids by stratum code and rank, density per hectare of basis area,
 * ordered stratum by stratum, primaries then reserves, each in rank order; every plot is checked to
 * lie in its stratum (plotsInStrataCheck) before it is written.
 */
function designPlotRecords(site: Site, constraints: PlacementConstraints, placement: DesignPlacement, basis: readonly number[]) {
  const keys = site.strata.map((s) => s.key);
  const ids = plotIdsFor(site.strata, placement.primaries, placement.reserves);
  const counters = keys.map(() => ({ primary: 0, reserve: 0 }));
  const density = keys.map((_, i) => (basis[i] > 0 ? placement.primaries[i] / (basis[i] / M2_PER_HA) : 0));
  const drafts = placement.placed.x.map((x, k) => {
    const s = placement.placed.stratum[k];
    const isReserve = placement.placed.reserve[k];
    const rank = isReserve ? ++counters[s].reserve : ++counters[s].primary;
    return {
      order: s * 2 + (isReserve ? 1 : 0),
      draft: {
        plotId: isReserve ? ids[s].reserve[rank - 1] : ids[s].primary[rank - 1],
        stratum: keys[s],
        role: isReserve ? ('reserve' as const) : ('primary' as const),
        rank,
        x,
        y: placement.placed.y[k],
        densityPerHa: density[s],
        transect: placement.placed.transect[k],
        chainageM: placement.placed.chainageM[k],
      },
    };
  });
  // Stratum by stratum, primaries then reserves, each in rank order (a stable sort keeps the rank order).
  drafts.sort((a, b) => a.order - b.order);
  plotsInStrataCheck(
    site,
    drafts.map(({ draft }) => {
      const [lon, lat] = constraints.frame.toLonLat(draft.x, draft.y);
      return { id: draft.plotId, stratum: draft.stratum, lon, lat };
    }),
  );
  const features = drafts.map((d) => plotRecord(constraints, d.draft));
  return features;
}

/**
 * Makes a whole survey design: stratum areas on the WGS84 ellipsoid (mapped and usable), the
 * allocation of plots (proportional, equal or Neyman, the smallest size meeting a target 95 % CI
 * half-width, or the largest a budget pays for; see designAllocation), placement in the site's UTM frame under every constraint (footprint wholly inside its
 * stratum, edge buffer, clear of buffered exclusions, minimum spacing), ranked reserves, and the
 * design summary with warnings and statements. Pure and deterministic: the same site, settings and
 * seed give byte-identical output in Node and in browsers.
 * Sources: Cochran, Sampling Techniques, 3rd ed. 1977, ch. 5 (allocation and sample size);
 * Robertson et al. 2013 (balanced acceptance sampling); see each step's module.
 * A relative target half-width is a fraction of `pilotMean` (0.1 = 10 %).
 * Throws InputError for settings or a map that make the design impossible (naming what and where).
 * The planner cancels a run by ending its worker, so the run polls nothing.
 */
export function designRun(site: Site, settings: DesignSettings, options: DesignRunOptions = {}): PlotCollection {
  designSettingsCheck(settings);
  const progress = options.onProgress ?? (() => {});
  if (site.strata.length === 0) throw new InputError('the site has no strata');
  designSizeCheck(settings, site.strata.length);
  const rngVersion = rngVersionOf(settings);
  // Only placement from triangles (generator versions 1 and 2) needs polygons small enough to triangulate.
  if (designSampling(rngVersion) === 'triangles') placementPolygonsCheck(site);
  progress(0, 'areas');
  const frame = siteLocalFrame(site.parts);
  const keys = site.strata.map((s) => s.key);
  const made = options.made && options.made.partAreas.length === site.parts.length && options.made.strata.length === site.strata.length ? options.made : undefined;
  const areas = designUsableAreas(site, frame, undefined, made?.partAreas);
  const { mapped, usable } = areas;
  const basis = settings.shareBasis === 'usable' ? usable : mapped;
  const totalBasis = basis.reduce((a, b) => a + b, 0);
  if (!(totalBasis > 0)) throw new InputError(`the strata have no ${settings.shareBasis} area to place plots in`);
  progress(0.2, 'allocation');
  const shares = designShares(keys, basis, settings);
  const { allocation, weights } = shares;
  const warnings: string[] = [...areas.warnings, ...shares.warnings];
  const extraStatements = shares.statements;
  progress(0.3, 'placing');
  const constraints = placementConstraintsBuild(site, frame, {
    footprint: settings.footprint,
    edgeBufferM: settings.edgeBufferM,
    strataMade: made?.strata,
    sampling: designSampling(rngVersion),
  });
  if (allocation) designCapacityCheck(constraints, settings.spacingM, allocation.plots, settings.reservePerStratum);
  const streams = rngStreams(settings.seed, rngVersion);
  let ticks = 0;
  const placement = designPlace(constraints, settings, {
    wanted: allocation?.plots ?? keys.map(() => 0),
    weights,
    basisM2: basis,
    streams,
    hooks: {
      tick: () => {
        if (++ticks % 16 === 0) progress(Math.min(0.9, 0.3 + ticks / 4000), 'placing');
      },
    },
  });
  warnings.push(...placement.warnings);
  progress(0.9, 'writing');
  const features = designPlotRecords(site, constraints, placement, basis);
  const rows: AllocationRow[] = keys.map((key, i) => ({
    stratum: key,
    mapped_m2: roundTo(mapped[i], 2),
    usable_m2: roundTo(usable[i], 2),
    share: roundTo(basis[i] / totalBasis, 6),
    plots: placement.primaries[i],
    reserve: placement.reserves[i],
    capacity: placement.capacity[i],
  }));
  const statements = [...designStatements(settings, constraints.convergenceDeg), ...placement.statements, ...extraStatements];
  statements.push(`Seed ${settings.seed}, ${rngVersionText(rngVersion)}.`);
  if (rngVersion === 1) {
    warnings.push(
      'Made with random generator version 1, as plans saved before version 2 were: the plots are reproduced exactly, but designs from neighbouring seeds are correlated. Switch to version 2 for a new design.',
    );
  }
  progress(1, 'done');
  return {
    type: 'FeatureCollection',
    features,
    design: {
      settings: { ...settings, rngVersion },
      seed: settings.seed,
      crs: { utm_zone: frame.utmZone, epsg: frame.epsg },
      allocation: rows,
      warnings,
      statements,
      software: { name: 'stratplot', version: STRATPLOT_VERSION },
    },
  };
}

import type { Feature, Point } from 'geojson';
import { STRATPLOT_VERSION } from '../common/version';
import { designSettingsDefault } from './designSettingsDefault';
import type { AllocationRow, PlotCollection, PlotProperties, RngVersion } from '../model/designTypes';
import { placementPolygonsCheck } from './designSizeCheck';
import { limitExceeded, limitNumber, MAX_DESIGN_PLOTS } from '../common/inputLimits';
import { InputError } from '../common/InputError';
import { FIT_OK, placementConstraintsBuild } from './place/placementConstraints';
import { footprintShapeXY } from './place/placementFootprint';
import { plotRecord } from './plotRecord';
import { plotsPlaceRandom } from './place/plotsPlaceRandom';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { rngStreams, rngVersionText } from './place/rngStreams';
import { convexSegmentDistance } from '../geometry/segmentDistance';
import { siteLocalFrame } from '../geo/siteLocalFrame';
import { stratumUsableRegion } from '../site/stratumUsableRegion';
import type { Site } from '../model/types';
import { M2_PER_HA } from '../common/units';

/** Settings of a trapping layout. */
export interface TrapGridOptions {
  /** G: grids in every stratum (or per stratum key; strata not listed get none). */
  gridsPerStratum: number | Readonly<Record<string, number>>;
  /** r × c stations per grid (rows named A, B, …; at most 26). */
  rows: number;
  cols: number;
  /** Ground metres between neighbouring stations. */
  spacingM: number;
  /** Ground metres every grid's outline keeps from every other grid's. */
  minSeparationM: number;
  /** Ground metres the grid's outline keeps from its stratum's boundary (default 0). */
  edgeBufferM?: number;
  /** Turn of the grid's rows from true east, degrees clockwise (default 0: rows run east–west). */
  angleDeg?: number;
  seed: number;
  /** Candidate centres tried per grid before giving up on it (default 4000). */
  maxTriesPerGrid?: number;
}

/** One placed grid. */
export interface TrapGrid {
  grid: string;
  stratum: string;
  centre: [lon: number, lat: number];
  stations: number;
}

/**
 * Stations as a plot file (role primary, so every plot exporter and `stratplot estimate` read it),
 * with the grids listed; `design.warnings` says what could not be placed and `design.statements`
 * how the grids were placed and the field cautions.
 */
export type TrapGridLayout = PlotCollection & { grids: TrapGrid[] };

/** Field cautions printed with every trapping layout. */
export const TRAP_GRID_CAUTIONS = [
  'Mapped buffers are a planning aid, not a guarantee of safe ground: near cliffs, water, remote ground or private land follow local codes, get the landholder’s permission and work to your employer’s safety plan; leave out any station that is unsafe on the day and record it.',
  'Trap and handle animals only under the permits and animal-ethics approval your jurisdiction requires; check traps as often as those conditions set.',
];

const ROW_NAMES = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';

function whole(name: string, v: number, min: number, max = Number.POSITIVE_INFINITY): void {
  if (!Number.isInteger(v) || v < min || v > max) {
    throw new InputError(`${name} must be a whole number from ${min}${Number.isFinite(max) ? ` to ${max}` : ' up'}, got ${v}`);
  }
}

/** Refuses trap-grid options that cannot make a layout, naming the option: sizes, distances, grids per stratum and the station cap. */
function trapGridOptionsCheck(site: Site, options: TrapGridOptions): void {
  const { rows, cols, spacingM, minSeparationM } = options;
  whole('rows', rows, 1, ROW_NAMES.length);
  whole('columns', cols, 1, 99);
  if (!(spacingM > 0 && Number.isFinite(spacingM))) throw new InputError(`station spacing must be > 0 m, got ${spacingM}`);
  if (!(minSeparationM >= 0 && Number.isFinite(minSeparationM))) throw new InputError(`grid separation must be ≥ 0 m, got ${minSeparationM}`);
  const edgeBufferM = options.edgeBufferM ?? 0;
  if (!(edgeBufferM >= 0)) throw new InputError(`edge buffer must be ≥ 0 m, got ${edgeBufferM}`);
  const perStratum = options.gridsPerStratum;
  const keys = site.strata.map((s) => s.key);
  if (typeof perStratum === 'number') whole('grids per stratum', perStratum, 0);
  else {
    for (const [k, g] of Object.entries(perStratum)) {
      if (!keys.includes(k)) throw new InputError(`grids given for stratum "${k}", which is not in the site; strata are ${keys.join(', ')}`);
      whole(`grids in stratum "${k}"`, g, 0);
    }
  }
  // Every grid asked for is tried (a bounded number of draws each), so the request itself is capped.
  const gridsAsked = typeof perStratum === 'number' ? perStratum * keys.length : Object.values(perStratum).reduce((a, b) => a + b, 0);
  if (gridsAsked * rows * cols > MAX_DESIGN_PLOTS) {
    throw limitExceeded('trap grids', `${limitNumber(gridsAsked)} grids of ${rows} × ${cols} stations make ${limitNumber(gridsAsked * rows * cols)} stations`, `${limitNumber(MAX_DESIGN_PLOTS)} plots in one design`);
  }
  const angleDeg = options.angleDeg ?? 0;
  if (!Number.isFinite(angleDeg)) throw new InputError(`grid angle must be a number of degrees, got ${angleDeg}`);
}

/**
 * The separation rule between trap grids: a hash of the grid centres placed so far, and whether a
 * new centre keeps its whole outline at least `sepGrid` from every placed grid's outline.
 */
function trapGridSeparation(outline: { vx: Float64Array; vy: Float64Array }, cell: number, sepGrid: number) {
  // Grid hash of placed grid centres: two outlines closer than the separation have centres closer
  // than one outline diagonal plus the separation, so only the 3 × 3 neighbouring cells are looked at.
  const placed = new Map<string, [number, number][]>();
  const cellKey = (x: number, y: number) => `${Math.floor(x / cell)},${Math.floor(y / cell)}`;
  const outlineDistance = (ax: number, ay: number, bx: number, by: number): number => {
    let best = Number.POSITIVE_INFINITY;
    const { vx, vy } = outline;
    for (let i = 0, j = vx.length - 1; i < vx.length; j = i++) {
      best = Math.min(
        best,
        convexSegmentDistance(ax, ay, vx, vy, bx + vx[j], by + vy[j], bx + vx[i], by + vy[i]),
        convexSegmentDistance(bx, by, vx, vy, ax + vx[j], ay + vy[j], ax + vx[i], ay + vy[i]),
      );
    }
    return best;
  };
  const isFarFromGrids = (x: number, y: number): boolean => {
    const ix = Math.floor(x / cell);
    const iy = Math.floor(y / cell);
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        for (const [px, py] of placed.get(`${ix + dx},${iy + dy}`) ?? []) {
          if (outlineDistance(x, y, px, py) < sepGrid) return false;
        }
      }
    }
    return true;
  };

  const add = (x: number, y: number): void => {
    const k = cellKey(x, y);
    placed.set(k, [...(placed.get(k) ?? []), [x, y]]);
  };
  return { isFarFromGrids, add };
}

/**
 * Places trapping grids: in each stratum G grids of r × c stations `spacingM` apart, each grid's
 * whole outline inside its stratum (with the edge buffer) and clear of every exclusion widened by
 * its buffer, and every two grids at least `minSeparationM` apart outline to outline. Grid centres
 * are drawn uniformly over the stratum (the design engine's random candidates) and kept by
 * sequential inhibition (Diggle, Statistical Analysis of Spatial Point Patterns, 2nd ed. 2003,
 * section from memory: draw, reject on a constraint, repeat), a bounded number of tries per grid; grid rows face
 * true east turned by `angleDeg` (the UTM meridian convergence is allowed for). The grid outline is
 * tested as one rectangular footprint through the design engine's placement constraints, so the
 * ground between stations is checked too, not only the stations. Station ids are grid + row letter +
 * column, e.g. "G1-A03"; grids are numbered in stratum order. Seeded: same inputs, same layout.
 * @throws InputError for sizes that are not whole numbers, more than 26 rows, a spacing or
 *   separation that is not a number ≥ 0, an unknown stratum key in `gridsPerStratum`, or more
 *   stations in all than MAX_DESIGN_PLOTS
 */
/**
 * The generator version of trap-grid layouts: grid centres are drawn from each stratum's triangles
 * as they were when version 2 was current, so a seed keeps giving the same layout.
 */
const TRAP_GRID_RNG_VERSION: RngVersion = 2;

export function trapGridsPlace(site: Site, options: TrapGridOptions): TrapGridLayout {
  const { rows, cols, spacingM, minSeparationM } = options;
  trapGridOptionsCheck(site, options);
  const edgeBufferM = options.edgeBufferM ?? 0;
  const perStratum = options.gridsPerStratum;
  const keys = site.strata.map((s) => s.key);
  const angleDeg = options.angleDeg ?? 0;
  placementPolygonsCheck(site);
  const frame = siteLocalFrame(site.parts);
  const widthM = Math.max((cols - 1) * spacingM, 1e-3);
  const heightM = Math.max((rows - 1) * spacingM, 1e-3);
  const c = placementConstraintsBuild(site, frame, { footprint: { shape: 'rect', widthM, heightM, angleDeg }, edgeBufferM });
  const outline = footprintShapeXY({ shape: 'rect', widthM, heightM, angleDeg }, c.scale, c.convergenceDeg);
  const beta = ((angleDeg + c.convergenceDeg) * Math.PI) / 180;
  const cosB = Math.cos(beta);
  const sinB = Math.sin(beta);
  const sepGrid = minSeparationM * c.scale;
  // Two outlines closer than the separation have centres closer than one outline diagonal plus the
  // separation, so a hash of that cell size looks at 3 × 3 neighbouring cells only.
  const separation = trapGridSeparation(outline, Math.hypot(widthM, heightM) * c.scale + sepGrid + 1e-6, sepGrid);

  const streams = rngStreams(options.seed, TRAP_GRID_RNG_VERSION);
  const maxTries = options.maxTriesPerGrid ?? 4000;
  const features: Feature<Point, PlotProperties>[] = [];
  const grids: TrapGrid[] = [];
  const warnings: string[] = [];
  const candidate = new Float64Array(2);
  const mappedM2 = keys.map((key) => site.parts.filter((p) => p.stratum === key).reduce((a, p) => a + polygonAreaM2(p.geometry), 0));
  const usableM2 = keys.map((key, i) => (mappedM2[i] > 0 ? stratumUsableRegion(site, key, frame).areaM2 : 0));
  const stationsIn = keys.map(() => 0);
  for (let s = 0; s < keys.length; s++) {
    const key = keys[s];
    const wanted = typeof perStratum === 'number' ? perStratum : (perStratum[key] ?? 0);
    if (wanted === 0) continue;
    const source = plotsPlaceRandom(c, s, streams.stream('trap-grids', s));
    const centres: [number, number][] = [];
    for (let g = 0; g < wanted; g++) {
      let found = false;
      for (let t = 0; t < maxTries && !found; t++) {
        if (!source.next(candidate)) break;
        const [x, y] = candidate;
        if (c.check(s, x, y, source.insideByConstruction) !== FIT_OK || !separation.isFarFromGrids(x, y)) continue;
        centres.push([x, y]);
        separation.add(x, y);
        found = true;
      }
      if (!found) {
        warnings.push(
          `stratum "${key}": only ${centres.length} of ${wanted} trap grids fit (${rows} × ${cols} stations ${spacingM} m apart, ${minSeparationM} m between grids, clear of buffered exclusions); shrink the grids or the separation`,
        );
        break;
      }
    }
    const areaHa = usableM2[s] / M2_PER_HA;
    stationsIn[s] = centres.length * rows * cols;
    const density = areaHa > 0 ? stationsIn[s] / areaHa : 0;
    let rank = 0;
    for (const [x0, y0] of centres) {
      const grid = `G${grids.length + 1}`;
      for (let i = 0; i < rows; i++) {
        for (let j = 0; j < cols; j++) {
          const e = (j - (cols - 1) / 2) * spacingM * c.scale;
          const n = ((rows - 1) / 2 - i) * spacingM * c.scale;
          rank += 1;
          const f = plotRecord(c, {
            plotId: `${grid}-${ROW_NAMES[i]}${String(j + 1).padStart(2, '0')}`,
            stratum: key,
            role: 'primary',
            rank,
            x: x0 + e * cosB + n * sinB,
            y: y0 - e * sinB + n * cosB,
            densityPerHa: density,
          });
          f.properties.notes = `trap grid ${grid}, row ${ROW_NAMES[i]}, column ${j + 1}`;
          features.push(f);
        }
      }
      const [lon, lat] = frame.toLonLat(x0, y0);
      grids.push({ grid, stratum: key, centre: [Math.round(lon * 1e7) / 1e7, Math.round(lat * 1e7) / 1e7], stations: rows * cols });
    }
  }
  const statements = [
    `Each grid is ${rows} × ${cols} stations ${spacingM} m apart, rows running ${angleDeg === 0 ? 'true east–west' : `${angleDeg}° clockwise from true east`}; the whole grid outline lies inside its stratum${edgeBufferM > 0 ? ` at least ${edgeBufferM} m from its edge` : ''}, clear of every buffered exclusion, and at least ${minSeparationM} m from every other grid.`,
    `Grid centres drawn at random over each stratum, seed ${options.seed}, ${rngVersionText(TRAP_GRID_RNG_VERSION)}.`,
    'Station densities and stratum shares use the usable area: the mapped area less every exclusion widened by its buffer.',
    ...TRAP_GRID_CAUTIONS,
  ];
  const totalUsable = usableM2.reduce((a, b) => a + b, 0);
  const allocation: AllocationRow[] = keys.map((key, i) => ({
    stratum: key,
    mapped_m2: Math.round(mappedM2[i] * 100) / 100,
    usable_m2: Math.round(usableM2[i] * 100) / 100,
    share: totalUsable > 0 ? Math.round((usableM2[i] / totalUsable) * 1e6) / 1e6 : 0,
    plots: stationsIn[i],
    reserve: 0,
    capacity: null,
  }));
  const settings = designSettingsDefault({ plots: features.length, seed: options.seed, edgeBufferM, spacingM, reservePerStratum: 0, rngVersion: TRAP_GRID_RNG_VERSION });
  return {
    type: 'FeatureCollection',
    features,
    grids,
    design: {
      settings,
      seed: options.seed,
      crs: { utm_zone: frame.utmZone, epsg: frame.epsg },
      allocation,
      warnings,
      statements,
      software: { name: 'stratplot', version: STRATPLOT_VERSION },
    },
  };
}

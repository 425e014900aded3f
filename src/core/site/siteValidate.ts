import type { Position } from 'geojson';
import { coordinateProblems, type PositionedFeature } from './coordinateProblems';
import { holeProblems } from './holeProblems';
import { multiPolygonOverlaps } from './multiPolygonOverlaps';
import { polygonSelfIntersections } from '../geometry/polygonSelfIntersections';
import { problemMake } from '../common/problemMake';
import { ringProblems } from './ringProblems';
import { strataGaps } from './strataGaps';
import { strataOverlaps } from './strataOverlaps';
import type { AreaGeometry, ExclusionGeometry, Problem, ProblemLocation, Site } from '../model/types';

/** Every position of a geometry, as the runs (rings, lines) it already holds: no copy of a large map's vertices. */
function positionRuns(g: AreaGeometry | ExclusionGeometry): (readonly Position[])[] {
  switch (g.type) {
    case 'Point':
      return [[g.coordinates]];
    case 'MultiPoint':
    case 'LineString':
      return [g.coordinates];
    case 'MultiLineString':
    case 'Polygon':
      return g.coordinates;
    case 'MultiPolygon':
      return g.coordinates.flat();
  }
}

/** Appends every item of `items` to `list` in a loop: a spread of a very long list into push overflows the call stack. */
function pushAll<T>(list: T[], items: readonly T[]): void {
  for (const item of items) list.push(item);
}

/**
 * A ring without duplicate consecutive vertices (a zero-length edge would meet its neighbours'
 * neighbours): the ring itself when it has none, as nearly every ring of a large map, so its
 * vertices are not copied.
 */
function ringWithoutRepeats(ring: readonly Position[]): readonly Position[] {
  let i = 1;
  while (i < ring.length && (ring[i][0] !== ring[i - 1][0] || ring[i][1] !== ring[i - 1][1])) i++;
  if (i >= ring.length) return ring;
  return ring.filter((p, k) => k === 0 || p[0] !== ring[k - 1][0] || p[1] !== ring[k - 1][1]);
}

/** Ring, hole and self-intersection problems of a polygonal geometry; true in `ok` when it has none that are errors. */
function polygonProblems(g: AreaGeometry, where: ProblemLocation): { problems: Problem[]; ok: boolean } {
  const polys = g.type === 'Polygon' ? [g.coordinates] : g.coordinates;
  const problems: Problem[] = [];
  if (polys.length === 0 || polys.every((p) => p.length === 0)) {
    return { problems: [problemMake('error', 'polygon-empty', where, 'polygon has no rings')], ok: false };
  }
  for (const rings of polys) {
    const ringIssues = rings.flatMap((ring, r) => ringProblems(ring, { ...where, ring: r }));
    pushAll(problems, ringIssues);
    if (ringIssues.some((p) => p.severity === 'error')) continue;
    const deduped = rings.map(ringWithoutRepeats);
    pushAll(problems, holeProblems(deduped, where));
    pushAll(problems, polygonSelfIntersections(deduped, where));
  }
  return { problems, ok: !problems.some((p) => p.severity === 'error') };
}

/**
 * Everything wrong with a site's geometry, errors first in input order, then warnings:
 * coordinates out of range, swapped or in projected metres; rings unclosed, with duplicate
 * consecutive vertices, spikes or fewer than 3 distinct points; holes outside their shell;
 * self-intersections; overlapping polygons within one MultiPolygon and overlapping strata features
 * (with overlap area, m²); and gaps inside the
 * site boundary that no stratum covers (warnings; only when the site has a boundary).
 * Each problem names the feature (layer, index in its layer, id) and a [lon, lat] to zoom to.
 * Geometry checks are skipped for features whose coordinates are unusable, and overlap/gap
 * checks use only features without errors. Never throws for bad geometry: it reports it.
 */
export function siteValidate(site: Site): Problem[] {
  const problems: Problem[] = [];
  const layerFeatures = <T>(items: readonly T[], layer: ProblemLocation['layer'], geom: (t: T) => AreaGeometry | ExclusionGeometry, id: (t: T) => string) =>
    items.map<PositionedFeature>((t, i) => ({ where: { featureIndex: i, featureId: id(t) || undefined, layer }, runs: positionRuns(geom(t)) }));

  const strata = layerFeatures(site.parts, 'strata', (p) => p.geometry, (p) => p.id);
  const coordIssues = coordinateProblems(strata);
  pushAll(problems, coordIssues);
  const badCoords = new Set(coordIssues.map((p) => p.where.featureIndex));
  const clean: number[] = [];
  site.parts.forEach((part, i) => {
    if (badCoords.has(i)) return;
    const { problems: found, ok } = polygonProblems(part.geometry, strata[i].where);
    pushAll(problems, found);
    if (!ok) return;
    const overlaps = multiPolygonOverlaps(part.geometry, strata[i].where);
    pushAll(problems, overlaps);
    if (overlaps.length === 0) clean.push(i);
  });

  const exclusions = layerFeatures(site.exclusions, 'exclusions', (e) => e.geometry, (e) => e.id);
  const exclusionCoordIssues = coordinateProblems(exclusions);
  pushAll(problems, exclusionCoordIssues);
  const badExclusions = new Set(exclusionCoordIssues.map((p) => p.where.featureIndex));
  site.exclusions.forEach((e, i) => {
    if (badExclusions.has(i) || (e.geometry.type !== 'Polygon' && e.geometry.type !== 'MultiPolygon')) return;
    pushAll(problems, polygonProblems(e.geometry, exclusions[i].where).problems);
  });

  problems.push(
    ...coordinateProblems(site.access.map((a, i) => ({ where: { featureIndex: i, featureId: a.id, layer: 'access' }, runs: [[[a.lon, a.lat]]] }))),
  );

  let boundaryOk = false;
  if (site.boundary) {
    const where: ProblemLocation = { featureIndex: 0, layer: 'boundary' };
    const issues = coordinateProblems([{ where, runs: positionRuns(site.boundary) }]);
    pushAll(problems, issues);
    if (issues.length === 0) {
      const { problems: found, ok } = polygonProblems(site.boundary, where);
      pushAll(problems, found);
      boundaryOk = ok;
    }
  }

  if (clean.length > 0) {
    const parts = clean.map((i) => site.parts[i]);
    pushAll(problems, strataOverlaps(parts, clean));
    if (site.boundary && boundaryOk) pushAll(problems, strataGaps(site.boundary, parts));
  }
  return [...problems.filter((p) => p.severity === 'error'), ...problems.filter((p) => p.severity === 'warning')];
}

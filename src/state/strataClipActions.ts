import type { MultiPolygon, Polygon } from 'geojson';
import * as polyclip from 'polyclip-ts';
import { InputError } from '../core/common/InputError';
import type { AreaGeometry } from '../core/model/types';
import type { PlannerStore } from './plannerStore';
import { siteCommit } from './siteCommit';
import { stratumPartAdd } from './strataActions';

type Geom = polyclip.Geom;

function toGeom(g: AreaGeometry): Geom {
  return g.coordinates as unknown as Geom;
}

/** MultiPolygon coordinates back to the smallest GeoJSON geometry, or null when nothing is left. */
function fromMulti(m: polyclip.Geom): AreaGeometry | null {
  const polys = m as unknown as number[][][][];
  if (polys.length === 0) return null;
  if (polys.length === 1) return { type: 'Polygon', coordinates: polys[0] } satisfies Polygon;
  return { type: 'MultiPolygon', coordinates: polys } satisfies MultiPolygon;
}

/**
 * Adds a stratum feature drawn next to existing strata: the new polygon is clipped by every
 * existing stratum feature (polygon difference, polyclip-ts — Martínez–Rueda sweep line), so
 * neighbours share edges instead of overlapping. Returns the new part id.
 * Throws InputError when the polygon lies wholly inside existing strata.
 */
export function stratumPartAddBeside(store: PlannerStore, stratumKey: string, polygon: Polygon): string {
  const others = store.getState().site.parts.map((p) => toGeom(p.geometry));
  const left = others.length ? fromMulti(polyclip.difference(toGeom(polygon), ...others)) : polygon;
  if (!left) throw new InputError('the new stratum lies wholly inside strata already mapped: nothing left to add');
  return stratumPartAdd(store, stratumKey, left);
}

/**
 * Cuts a hole: subtracts the drawn polygon from every stratum feature it overlaps (features it
 * swallows whole are removed). Returns how many features changed.
 * Throws InputError when the polygon overlaps no stratum.
 */
export function stratumHoleCut(store: PlannerStore, polygon: Polygon): number {
  const cutter = toGeom(polygon);
  let changed = 0;
  siteCommit(store, (site) => {
    const parts = [];
    for (const part of site.parts) {
      const overlap = polyclip.intersection(toGeom(part.geometry), cutter);
      if (overlap.length === 0) {
        parts.push(part);
        continue;
      }
      changed++;
      const rest = fromMulti(polyclip.difference(toGeom(part.geometry), cutter));
      if (rest) parts.push({ ...part, geometry: rest });
    }
    if (changed === 0) throw new InputError('the hole does not overlap any stratum: draw it inside a stratum');
    return { ...site, parts };
  });
  return changed;
}

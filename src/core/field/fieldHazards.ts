import { exclusionProximityIndex } from '../geometry/exclusionProximityIndex';
import type { LocalFrame } from '../geo/localFrame';
import { EXCLUSION_KINDS, type Exclusion } from '../model/types';

/** An exclusion whose buffered ground holds a point or meets a straight line. */
export interface FieldHazard {
  exclusion: Exclusion;
  /** Distance to the exclusion's own geometry, metres (0 inside a polygon or where a line crosses it). */
  distanceM: number;
}

/** The exclusions near the crew: at its position, and along the straight line to a plot. */
export interface FieldHazardIndex {
  /** Exclusions whose buffer (or area) holds the point, nearest first. */
  at(lon: number, lat: number): FieldHazard[];
  /** Exclusions whose buffer the straight line from one point to another enters, nearest first. */
  along(from: { lon: number; lat: number }, to: { lon: number; lat: number }): FieldHazard[];
}

/**
 * Builds the hazard look-ups of the field view over every exclusion of the site, each with its own
 * safety buffer, in the site's metric frame (planar distances, within the zone's scale error of
 * ~0.1 %: see exclusionProximityIndex).
 */
export function fieldHazardIndex(exclusions: readonly Exclusion[], frame: LocalFrame): FieldHazardIndex {
  const index = exclusionProximityIndex(exclusions, frame);
  const byDistance = (hits: FieldHazard[]) => hits.sort((a, b) => a.distanceM - b.distanceM);
  return {
    at(lon, lat) {
      const [x, y] = frame.toXY(lon, lat);
      return byDistance(index.crossedBy(x, y, x, y, EXCLUSION_KINDS, 0));
    },
    along(from, to) {
      const [ax, ay] = frame.toXY(from.lon, from.lat);
      const [bx, by] = frame.toXY(to.lon, to.lat);
      return byDistance(index.crossedBy(ax, ay, bx, by, EXCLUSION_KINDS, 0));
    },
  };
}

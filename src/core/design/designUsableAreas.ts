import type { LocalFrame } from '../geo/localFrame';
import type { Site } from '../model/types';
import { type PartAreas, partAreasMeasurer } from './partAreas';

/**
 * Mapped and usable area of every stratum, m² on the WGS84 ellipsoid, in site order: the sum over
 * its parts, in site order, of each part's areas ({@link partAreasMeasurer}, or `made` where another
 * thread has measured every part of this site). Summing parts equals the stratum's usable area
 * because parts of a valid site do not overlap (overlaps are errors in siteValidate).
 */
export function designUsableAreas(
  site: Site,
  frame: LocalFrame,
  tick: () => void = () => {},
  made?: readonly PartAreas[],
): { mapped: number[]; usable: number[]; warnings: string[] } {
  const warnings: string[] = [];
  const index = new Map(site.strata.map((s, i) => [s.key, i]));
  const mapped = site.strata.map(() => 0);
  const usable = site.strata.map(() => 0);
  const measure = made ? (i: number) => made[i] : partAreasMeasurer(site, frame);
  for (let i = 0; i < site.parts.length; i++) {
    const s = index.get(site.parts[i].stratum);
    if (s === undefined) continue;
    tick();
    const part = measure(i);
    mapped[s] += part.mapped;
    usable[s] += part.usable;
    if (part.warning) warnings.push(part.warning);
  }
  return { mapped, usable, warnings };
}

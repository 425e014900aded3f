import type { DesignSettings } from '../model/designTypes';
import { footprintFormat } from './footprintParse';

/**
 * The plain-language statements every design carries: what the shares are based on, what the
 * estimates can cover, the reserve rule, how footprints face, the spacing, and the safety caution.
 * @param convergenceDeg meridian convergence at the site centre, degrees (true north from grid north, clockwise)
 */
export function designStatements(s: DesignSettings, convergenceDeg: number): string[] {
  const out: string[] = [];
  out.push(
    s.shareBasis === 'usable'
      ? 'Stratum shares are based on the usable area: the mapped area less every exclusion widened by its safety buffer, measured on the WGS84 ellipsoid.'
      : 'Stratum shares are based on the mapped area of each stratum, measured on the WGS84 ellipsoid (exclusions not subtracted).',
  );
  out.push(
    'Inference covers the usable area only: ground inside buffered exclusions (and within the edge buffer) had no chance of holding a plot, so estimates say nothing about it.',
  );
  if (s.reservePerStratum > 0) {
    out.push(
      'Reserve rule: when a primary plot cannot be sampled (unsafe, no access, or not the mapped habitat), record why, then use the lowest-ranked unused reserve of the same stratum (R1, then R2, …), strictly in rank order and never by convenience.',
    );
  } else {
    out.push('No reserve plots: a primary plot that cannot be sampled is recorded as missing, with the reason.');
  }
  if (s.footprint.shape === 'point') {
    out.push('Plots are points (no footprint).');
  } else {
    out.push(
      `Footprint ${footprintFormat(s.footprint)} (metres), wholly inside its stratum; edges face TRUE north${s.footprint.shape !== 'circle' && s.footprint.angleDeg ? ` turned ${s.footprint.angleDeg}° clockwise` : ''} — the UTM grid is turned ${convergenceDeg.toFixed(3)}° from true north here (meridian convergence), and the footprint is turned to match.`,
    );
  }
  if (s.spacingM > 0) out.push(`Plot centres are at least ${s.spacingM} m apart, across strata, primaries and reserves.`);
  if (s.edgeBufferM > 0) out.push(`Footprints keep at least ${s.edgeBufferM} m from their stratum's boundary.`);
  out.push(
    'Safety: mapped buffers are a planning aid, not a guarantee of safe ground. Near cliffs, water, remote ground or private land, follow local codes, get the landholder\'s permission and work to your employer\'s safety plan; skip any plot that is unsafe on the day and use the reserve rule.',
  );
  return out;
}

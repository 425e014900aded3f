import type { LonLat, Problem, ProblemLocation } from '../model/types';

const LAYER_NOUN: Record<NonNullable<ProblemLocation['layer']>, string> = {
  strata: 'feature',
  exclusions: 'exclusion',
  access: 'access point',
  boundary: 'boundary',
};

/** "12.34567, -35.10000": a position for messages, 5 decimals (about 1 m). */
export function lonLatText(p: LonLat): string {
  return `${p[0].toFixed(5)}, ${p[1].toFixed(5)}`;
}

/**
 * A Problem whose message names the feature (layer noun, index and id), the ring when given,
 * what is wrong, and the position: e.g. `feature 3 (HEA-2), ring 0: crosses itself at 150.50123, -35.10045`.
 */
export function problemMake(
  severity: Problem['severity'],
  code: string,
  where: ProblemLocation,
  text: string,
  areaM2?: number,
): Problem {
  const noun = LAYER_NOUN[where.layer ?? 'strata'];
  const id = where.featureId ? ` (${where.featureId})` : '';
  const ring = where.ring !== undefined ? `, ring ${where.ring}` : '';
  const at = where.lonLat ? ` at ${lonLatText(where.lonLat)}` : '';
  const problem: Problem = { severity, code, message: `${noun} ${where.featureIndex}${id}${ring}: ${text}${at}`, where };
  if (areaM2 !== undefined) problem.areaM2 = areaM2;
  return problem;
}

import type { StratumInfo } from '../../model/types';

/** Longest plot id, so ids fit the name field of common handheld GPS units (common practice, no source). */
export const PLOT_ID_MAX_LENGTH = 10;

function digits(n: number): number {
  return String(Math.max(1, n)).length;
}

/**
 * One short, distinct, upper-case code per stratum for plot ids: the stratum's own code cleaned to
 * A–Z and 0–9 (or the first letters of its key), cut to fit `maxLength`, and made unique by ending
 * later repeats with a digit (HEA, HE2, HE3 …).
 * @param maxLength longest code allowed (at least 1)
 */
export function plotCodesUnique(strata: readonly StratumInfo[], maxLength: number): string[] {
  const len = Math.max(1, maxLength);
  const used = new Set<string>();
  return strata.map((s, i) => {
    let base = (s.code || s.key).toUpperCase().replace(/[^A-Z0-9]/g, '');
    if (!base) base = `S${i + 1}`;
    base = base.slice(0, len);
    let code = base;
    for (let k = 2; used.has(code); k++) {
      const tail = String(k);
      code = base.slice(0, Math.max(0, len - tail.length)) + tail;
    }
    used.add(code);
    return code;
  });
}

/**
 * Plot ids for a design: primaries `CODE-07` (number padded to the width of the stratum's largest,
 * at least two digits), reserves `CODE-R2`; never longer than {@link PLOT_ID_MAX_LENGTH}, unique
 * because stratum codes are unique and the `-R` form cannot be a primary number.
 * @param primaries primary plots per stratum; @param reserves reserve plots per stratum
 * @returns per stratum, the primary ids (rank order) and the reserve ids (rank order)
 */
export function plotIdsFor(
  strata: readonly StratumInfo[],
  primaries: readonly number[],
  reserves: readonly number[],
): { primary: string[]; reserve: string[] }[] {
  const width = Math.max(2, ...primaries.map(digits));
  const reserveWidth = Math.max(1, ...reserves.map(digits));
  const room = PLOT_ID_MAX_LENGTH - 1 - Math.max(width, reserveWidth + 1);
  const codes = plotCodesUnique(strata, room);
  return codes.map((code, s) => ({
    primary: Array.from({ length: primaries[s] }, (_, k) => `${code}-${String(k + 1).padStart(width, '0')}`),
    reserve: Array.from({ length: reserves[s] }, (_, k) => `${code}-R${k + 1}`),
  }));
}

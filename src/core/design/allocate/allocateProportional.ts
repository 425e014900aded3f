import { type AllocationResult, allocateWithMinimum } from './allocateWithMinimum';
import { InputError } from '../../common/InputError';

/** A stratum as allocation sees it: its key and the area its share is based on (usable or mapped). */
export interface AllocationStratum {
  key: string;
  basisM2: number;
}

/**
 * Proportional allocation: n_h = n · A_h / A, rounded by largest remainder, with the minimum rule of
 * {@link allocateWithMinimum}.
 * Source: Cochran, Sampling Techniques, 3rd ed. 1977, §5.3 (proportional allocation; section number from memory).
 * @param strata key and basis area (m²) of each stratum
 * @param n total primary plots
 * @param minPerStratum whole plots every stratum must get (default 2)
 * Throws InputError for a negative area, for no area at all, or when the minimum cannot be met.
 */
export function allocateProportional(strata: readonly AllocationStratum[], n: number, minPerStratum = 2): AllocationResult {
  const keys = strata.map((s) => s.key);
  for (const s of strata) {
    if (!(Number.isFinite(s.basisM2) && s.basisM2 >= 0)) {
      throw new InputError(`stratum "${s.key}" has an invalid area ${s.basisM2} m²`);
    }
  }
  if (strata.length > 0 && strata.every((s) => s.basisM2 === 0)) {
    throw new InputError('no stratum has any area to share plots by');
  }
  return allocateWithMinimum(
    strata.map((s) => s.basisM2),
    n,
    minPerStratum,
    keys,
  );
}

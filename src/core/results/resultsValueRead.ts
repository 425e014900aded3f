import { MAX_RESULT_MAGNITUDE } from '../common/inputLimits';
import type { ResultKind } from '../model/designTypes';
import { type DecimalMark, resultsCellNumber, resultsCellPresence } from './resultsCellParse';

/** A measured value read from its text: the number (null for a blank), or why it cannot be used. */
export type ResultsValue =
  | { ok: true; value: number | null }
  | {
      ok: false;
      code: 'results-not-a-number' | 'results-too-large' | 'results-out-of-range' | 'results-fractional-count';
      /** What is wrong, to follow the place it was found, e.g. `"abc" is not a number`. */
      problem: string;
    };

/**
 * Reads one measured value as the results checks do, for a results table and for the field form
 * alike: a number with the table's decimal mark (or a presence/absence word), within
 * ±MAX_RESULT_MAGNITUDE, cover within 0–100 %, counts whole and not negative.
 * Ranges: cover is a percentage of the plot; a count is of individuals. Common practice, no source.
 */
export function resultsValueRead(cell: string, kind: ResultKind, decimal: DecimalMark): ResultsValue {
  const text = cell.trim();
  const value = kind === 'presence' ? resultsCellPresence(text) : resultsCellNumber(text, decimal);
  if (value === null) return { ok: true, value: null };
  if (Number.isNaN(value)) {
    const what =
      kind === 'presence'
        ? 'is not a presence/absence value (use 1/0, yes/no, y/n, present/absent, true/false)'
        : `is not a number${decimal === ',' ? ' (this file uses decimal commas)' : ''}`;
    return { ok: false, code: 'results-not-a-number', problem: `"${text}" ${what}` };
  }
  if (!(Math.abs(value) <= MAX_RESULT_MAGNITUDE)) {
    return { ok: false, code: 'results-too-large', problem: `${text.slice(0, 40)} is beyond ±${MAX_RESULT_MAGNITUDE} (stratplot's limit for a measured value)` };
  }
  if (kind === 'cover' && (value < 0 || value > 100)) return { ok: false, code: 'results-out-of-range', problem: `cover ${text} is outside 0–100 %` };
  if (kind === 'count' && value < 0) return { ok: false, code: 'results-out-of-range', problem: `count ${text} is negative` };
  if (kind === 'count' && !Number.isInteger(value)) {
    return { ok: false, code: 'results-fractional-count', problem: `count ${text} is not a whole number (if the column is not a count, give --kind measure)` };
  }
  return { ok: true, value };
}

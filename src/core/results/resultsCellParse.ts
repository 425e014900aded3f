import type { ResultKind } from '../model/designTypes';

/** How a results table writes decimals: "3.5" or "3,5". */
export type DecimalMark = '.' | ',';


const POINT_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const COMMA_NUMBER = /^[+-]?(\d+,?\d*|,\d+)([eE][+-]?\d+)?$/;

/**
 * Reads a number as a spreadsheet wrote it, with the file's decimal mark; a trailing "%" is
 * allowed (cover columns often carry it). No thousands separators: "1,234" with a decimal point
 * file is not a number, so a misread is reported rather than guessed.
 * @returns the number, null for a blank cell, or NaN when the text is not a number
 */
export function resultsCellNumber(text: string, decimal: DecimalMark): number | null {
  let t = text.trim();
  if (t === '') return null;
  if (t.endsWith('%')) t = t.slice(0, -1).trim();
  const pattern = decimal === ',' ? COMMA_NUMBER : POINT_NUMBER;
  if (!pattern.test(t)) return Number.NaN;
  return Number(decimal === ',' ? t.replace(',', '.') : t);
}

const PRESENT = new Set(['1', 'yes', 'y', 'present', 'true', 'p']);
const ABSENT = new Set(['0', 'no', 'n', 'absent', 'false', 'a']);

/**
 * Reads a presence/absence cell: 1/0, yes/no, y/n, present/absent, p/a, true/false, in any case.
 * @returns 1 or 0, null for a blank cell, NaN when the word is none of these
 */
export function resultsCellPresence(text: string): number | null {
  const t = text.trim().toLowerCase();
  if (t === '') return null;
  if (PRESENT.has(t)) return 1;
  if (ABSENT.has(t)) return 0;
  return Number.NaN;
}

/** True when the text is one of the presence/absence words (not counting 0/1, which are also numbers). */
export function isPresenceWord(text: string): boolean {
  const t = text.trim().toLowerCase();
  return t !== '0' && t !== '1' && (PRESENT.has(t) || ABSENT.has(t));
}

/**
 * Guesses the kind of a results column: presence when every filled cell is a presence word or
 * 0/1 and at least one is a word; cover when the name mentions cover or %; count when it says
 * count, number or abundance and no filled cell has a fractional part (a count is whole, so a
 * column holding 1.5 is a measurement whatever its name); otherwise a plain measurement. The CLI
 * lets the user override it.
 */
export function resultsKindGuess(column: string, cells: readonly string[]): ResultKind {
  const filled = cells.map((c) => c.trim()).filter((c) => c !== '');
  if (filled.length > 0 && filled.some(isPresenceWord) && filled.every((c) => !Number.isNaN(resultsCellPresence(c) ?? 0))) {
    return 'presence';
  }
  if (/cover|%|pct|percent/i.test(column)) return 'cover';
  if (/count|number|abundance|^n_|_n$|individuals|stems/i.test(column) && !filled.some((c) => /[.,]\d*[1-9]/.test(c))) return 'count';
  return 'measure';
}

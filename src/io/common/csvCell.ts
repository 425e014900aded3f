/**
 * First characters that make a spreadsheet read a text cell as a formula (OWASP "CSV Injection"),
 * with the full-width forms ＝ ＋ － ＠ (U+FF1D, U+FF0B, U+FF0D, U+FF20) that some spreadsheet
 * programs fold to their ASCII twins.
 */
const FORMULA_START = /^[=+\-@\t\r\uFF1D\uFF0B\uFF0D\uFF20]/;

/** Whether a spreadsheet would take text starting like this as a formula (see FORMULA_START). */
export function isFormulaStart(text: string): boolean {
  return FORMULA_START.test(text);
}

/**
 * A value ready for a CSV cell: numbers stay numbers (so -122.4 is written as a number, not
 * text), null/undefined become empty, objects become JSON, and text that starts with = + - @,
 * tab or CR (or a full-width ＝ ＋ － ＠) is prefixed with an apostrophe so spreadsheets show it
 * instead of evaluating it.
 * Source: OWASP, "CSV Injection" (owasp.org/www-community/attacks/CSV_Injection).
 */
export function csvCell(value: unknown): string | number {
  if (typeof value === 'number') return Number.isFinite(value) ? value : '';
  if (value === null || value === undefined) return '';
  const text = typeof value === 'object' ? JSON.stringify(value) : String(value);
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** Undoes {@link csvCell}'s apostrophe on text read back from a CSV we wrote. */
export function csvCellUnescape(text: string): string {
  return text.length > 1 && text[0] === "'" && FORMULA_START.test(text.slice(1)) ? text.slice(1) : text;
}

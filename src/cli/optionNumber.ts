/** Decimal numbers as people type them: optional sign, digits, point and exponent. */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The number an option's text spells in plain decimal notation, or NaN: "0x10", "Infinity", "1e400"
 * (which overflows), "" and "12abc" are not numbers here, although JavaScript's Number reads some of
 * them, so a mistyped option is refused rather than silently read as something else.
 */
export function optionNumber(text: string): number {
  const t = text.trim();
  if (!DECIMAL.test(t)) return Number.NaN;
  const x = Number(t);
  return Number.isFinite(x) ? x : Number.NaN;
}

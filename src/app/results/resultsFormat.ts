/**
 * A number for the results tables: grouped whole numbers from 1000 up, fewer decimals as values
 * grow, four significant digits below 1; "–" when not available.
 */
export function fmtValue(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '–';
  const a = Math.abs(v);
  if (a === 0) return '0';
  if (a >= 1000) return v.toLocaleString('en', { maximumFractionDigits: 0 });
  if (a >= 100) return v.toLocaleString('en', { minimumFractionDigits: 1, maximumFractionDigits: 1 });
  if (a >= 1) return v.toLocaleString('en', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
  return v.toLocaleString('en', { maximumSignificantDigits: 4 });
}

/** A 95 % interval as "low to high". */
export function fmtInterval(ci: readonly [number, number] | null | undefined): string {
  return ci ? `${fmtValue(ci[0])} to ${fmtValue(ci[1])}` : '–';
}


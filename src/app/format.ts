import { M2_PER_HA } from '../core/common/units';

/** Hectares with two decimals, for tables (1 ha = 10 000 m²). */
export function fmtHa(m2: number): string {
  return (m2 / M2_PER_HA).toLocaleString('en', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
}

/** A fraction 0–1 as a percentage with one decimal. */
export function fmtPct(share: number): string {
  return `${(share * 100).toFixed(1)} %`;
}

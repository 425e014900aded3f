/**
 * A count with its noun in English: "1 polygon", "2 polygons", "0 strata". The plural is the
 * noun plus "s" unless given (stratum → strata, primary → primaries). Pure text, no units.
 */
export function countNoun(n: number, singular: string, plural = `${singular}s`): string {
  return `${n.toLocaleString('en')} ${n === 1 ? singular : plural}`;
}

import type { StratumInfo } from '../model/types';

/**
 * A message with every stratum named in double quotes by its stable id ("Stratum 7") given its
 * current name instead ("Farm paddock"), the way the program's messages quote strata. Quoted text
 * that is no stratum id stays as it is. For messages made before a rename, shown after it.
 */
export function stratumNamesInText(text: string, strata: readonly Pick<StratumInfo, 'key' | 'label'>[]): string {
  const names = new Map(strata.filter((s) => s.key !== s.label).map((s) => [s.key, s.label]));
  return stratumNamesQuoted(text, names);
}

/** {@link stratumNamesInText} with the renaming given as a map from old to new name. */
export function stratumNamesQuoted(text: string, names: ReadonlyMap<string, string>): string {
  if (names.size === 0) return text;
  return text.replace(/"([^"]*)"/g, (whole, inner: string) => (names.has(inner) ? `"${names.get(inner)}"` : whole));
}

import type { Exclusion, ExclusionKind } from '../model/types';

/**
 * The standing note crews see for each kind of excluded ground. Wording is ours; the cautions are
 * common practice, no source: local codes, landholder agreements and the employer's safety plan govern.
 */
export const EXCLUSION_KIND_NOTES: Readonly<Record<ExclusionKind, string>> = {
  cliff: 'Cliff or unstable edge: keep behind the marked buffer; edges can be undercut and give way without warning.',
  water: 'Water: do not wade or swim to reach a plot; banks may be soft, undercut or tidal.',
  private: 'Private land: landholder permission required before entry.',
  hazard: 'Marked hazard: keep outside the buffer and read the hazard description before going near.',
  other: 'Excluded ground: not part of the survey; keep outside it.',
};

/** Short label of each exclusion kind for tables and map legends. */
export const EXCLUSION_KIND_LABELS: Readonly<Record<ExclusionKind, string>> = {
  cliff: 'Cliff edge',
  water: 'Water',
  private: 'Private land',
  hazard: 'Hazard',
  other: 'Other exclusion',
};

/**
 * The note for one exclusion: its kind's standing note, then its own name and notes when mapped.
 * @returns one line of text, e.g. "Private land: landholder permission required before entry. (Ridge farm: call ahead)".
 */
export function exclusionKindNote(exclusion: Pick<Exclusion, 'kind' | 'name' | 'notes'>): string {
  const base = EXCLUSION_KIND_NOTES[exclusion.kind] ?? EXCLUSION_KIND_NOTES.other;
  const own = [exclusion.name?.trim(), exclusion.notes?.trim()].filter((s): s is string => !!s);
  return own.length ? `${base} (${own.join(': ')})` : base;
}

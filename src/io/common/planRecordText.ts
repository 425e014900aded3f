/**
 * A browser copy of the work described by its parts: the plan's text with `savedAt` "" (its
 * content-hash text, planHashText), as the pieces it is joined from, the time it was written and
 * whether it had been saved to a file. Whoever holds the parts puts the stored text together: on
 * a million-vertex map the page hands the storage worker the pieces once instead of joining and
 * posting two 45 MB texts (the record and the hash text).
 */
export interface PlanRecord {
  hashTextPieces: readonly string[];
  savedAt: string;
  saved: boolean;
}

/** The plan's text with `savedAt` "", joined from a record's pieces. */
export function planRecordHashText(record: PlanRecord): string {
  return record.hashTextPieces.join('');
}

/** The head every plan's text begins with (format, version, then the empty save time). */
const BLANK_HEAD = /^(\{"format":"[^"\\]*","version":\d+,"savedAt":)""/;

/**
 * The stored text of a record, `{"plan":…,"saved":…}`: the hash text with the save time put in
 * at its head. A text that does not begin the usual way is parsed and written again (same value).
 */
export function planRecordText(record: PlanRecord): string {
  const [first = '', ...rest] = record.hashTextPieces;
  const head = BLANK_HEAD.exec(first.slice(0, 200));
  if (!head) return `{"plan":${JSON.stringify({ ...JSON.parse(planRecordHashText(record)), savedAt: record.savedAt })},"saved":${record.saved}}`;
  return ['{"plan":', head[1], JSON.stringify(record.savedAt), first.slice(head[0].length), ...rest, `,"saved":${record.saved}}`].join('');
}

/**
 * A record as it crosses to the storage worker: each piece the worker already holds (the same
 * text at some place in the previous record it was sent) is given by that place instead. After a
 * new design on a million-vertex map only the plots and the small parts cross, not the site's
 * 45 MB of geometry texts again.
 */
export interface PlanRecordDelta {
  pieces: (string | number)[];
  savedAt: string;
  saved: boolean;
}

/** Pieces shorter than this cross as they are: looking them up would cost more than copying them. */
const SHARED_PIECE_MIN_LENGTH = 4096;

/** `record` as a delta from `previous` (the pieces of the record the receiver holds). */
export function planRecordDelta(record: PlanRecord, previous: readonly string[]): PlanRecordDelta {
  const at = new Map<string, number>();
  for (let i = 0; i < previous.length; i++) if (previous[i].length >= SHARED_PIECE_MIN_LENGTH) at.set(previous[i], i);
  const pieces = record.hashTextPieces.map((p) => (p.length >= SHARED_PIECE_MIN_LENGTH ? (at.get(p) ?? p) : p));
  return { pieces, savedAt: record.savedAt, saved: record.saved };
}

/** The record a delta describes, its shared pieces taken from `previous` (planRecordDelta's inverse). */
export function planRecordFromDelta(delta: PlanRecordDelta, previous: readonly string[]): PlanRecord {
  const hashTextPieces = delta.pieces.map((p) => {
    if (typeof p === 'string') return p;
    const text = previous[p];
    // The page and this side keep the previous record in step; a gap would mean a corrupt copy.
    if (text === undefined) throw new Error(`the browser copy refers to a part of the previous copy that is not held (piece ${p})`);
    return text;
  });
  return { hashTextPieces, savedAt: delta.savedAt, saved: delta.saved };
}

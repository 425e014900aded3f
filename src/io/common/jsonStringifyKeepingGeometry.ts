/** Geometry types whose text is worth keeping: they carry the vertices of a map. */
const KEPT_TYPES = new Set(['Polygon', 'MultiPolygon', 'LineString', 'MultiLineString']);

/** Each geometry's or feature collection's JSON text, by object (the plan's are replaced, never edited in place). */
const texts = new WeakMap<object, string>();

const ABOVE_LATIN1 = /[\u0100-\uffff]/g;
const HAS_ABOVE_LATIN1 = /[\u0100-\uffff]/;

function escapeAboveLatin1(text: string): string {
  return HAS_ABOVE_LATIN1.test(text) ? text.replace(ABOVE_LATIN1, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`) : text;
}

/** A marker no JSON text of ours contains (a NUL cannot appear unescaped in JSON). */
const MARK = '\u0000g';

function isKept(v: unknown): v is object {
  if (typeof v !== 'object' || v === null) return false;
  const type = (v as { type?: unknown }).type;
  if (type === 'FeatureCollection') return Array.isArray((v as { features?: unknown }).features);
  return KEPT_TYPES.has(type as string) && Array.isArray((v as { coordinates?: unknown }).coordinates);
}

/**
 * JSON.stringify(value) with characters above U+00FF written as \uXXXX escapes (the same JSON
 * value, RFC 8259 §7), and with the text of each polygon and line geometry and each feature
 * collection (a design's plots) in it kept, by object, for the next call.
 * A plan is written again after every change, and on a mosaic of a million vertices walking the
 * coordinates each time is what held the page up: a plan whose site has not changed now costs
 * only its small parts. The escapes keep the text in the engine's one-byte form: a single em dash
 * in a 45 MB plan otherwise doubles it and the time of every copy of it to a worker.
 * Kept objects must not be edited in place after they have been written (the planner's store
 * replaces them), or the kept text goes stale.
 */
export function jsonStringifyKeepingGeometry(value: unknown): string {
  return jsonPiecesKeepingGeometry(value).join('');
}

/**
 * The text of jsonStringifyKeepingGeometry as the pieces it is joined from (kept texts and the
 * parts between them), for a caller that hands the text to a worker: posting the pieces copies
 * them once, where joining 45 MB first copies it twice and holds the page up for the join.
 */
export function jsonPiecesKeepingGeometry(value: unknown): string[] {
  const pieces: string[] = [];
  const skeleton = escapeAboveLatin1(
    JSON.stringify(value, (_key, v) => {
      if (!isKept(v)) return v;
      let text = texts.get(v);
      if (text === undefined) {
        text = escapeAboveLatin1(JSON.stringify(v));
        texts.set(v, text);
      }
      pieces.push(text);
      return MARK;
    }),
  );
  if (pieces.length === 0) return [skeleton];
  // The marker's JSON text: a quoted string with the NUL escaped.
  const parts = skeleton.split(JSON.stringify(MARK));
  // A text of the user's that happens to equal the marker: write it the plain way.
  if (parts.length !== pieces.length + 1) return [escapeAboveLatin1(JSON.stringify(value))];
  const out: string[] = [parts[0]];
  for (let i = 1; i < parts.length; i++) out.push(pieces[i - 1], parts[i]);
  return out;
}

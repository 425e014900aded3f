/** Geometry types whose text is worth keeping: they carry the vertices of a map. */
const KEPT_TYPES = new Set(['Polygon', 'MultiPolygon', 'LineString', 'MultiLineString']);

function isKeptCollection(v: object): boolean {
  return (v as { type?: unknown }).type === 'FeatureCollection' && Array.isArray((v as { features?: unknown }).features);
}

/** Each geometry's or feature collection's JSON text, by object (the plan's are replaced, never edited in place); one map per escaping. */
const texts = new WeakMap<object, string>();
const textsEscaped = new WeakMap<object, string>();

/** Options of jsonStringifyKeepingGeometry. */
export interface JsonKeepingOptions {
  /**
   * Write characters above U+00FF as \uXXXX escapes (the same JSON value, RFC 8259 §7). JavaScript
   * engines keep a text of Latin-1 characters in one byte per character: a single em dash in a
   * 45 MB plan doubles its size and the time of every copy of it to a worker. Default false.
   */
  escapeAboveLatin1?: boolean;
}

const ABOVE_LATIN1 = /[\u0100-\uffff]/g;
const HAS_ABOVE_LATIN1 = /[\u0100-\uffff]/;

function escapeAboveLatin1(text: string): string {
  return HAS_ABOVE_LATIN1.test(text) ? text.replace(ABOVE_LATIN1, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`) : text;
}

/** A marker no JSON text of ours contains (a NUL cannot appear unescaped in JSON). */
const MARK = '\u0000g';

function isKept(v: unknown): v is object {
  if (typeof v !== 'object' || v === null) return false;
  return (KEPT_TYPES.has((v as { type?: unknown }).type as string) && Array.isArray((v as { coordinates?: unknown }).coordinates)) || isKeptCollection(v);
}

/**
 * JSON.stringify(value), the same text character for character, with the text of each polygon and
 * line geometry and each feature collection (a design's plots) in it kept (by object) for the next call. A plan is written again after every
 * change, and on a mosaic of a million vertices walking the coordinates again each time is what
 * holds the page up: a plan whose site has not changed now costs only its small parts.
 * Those objects must not be edited in place after they have been written (the planner's store
 * replaces them), or the kept text goes stale.
 */
export function jsonStringifyKeepingGeometry(value: unknown, options: JsonKeepingOptions = {}): string {
  const escaping = options.escapeAboveLatin1 === true;
  const kept = escaping ? textsEscaped : texts;
  const pieces: string[] = [];
  const plain = JSON.stringify(value, (_key, v) => {
    if (!isKept(v)) return v;
    let text = kept.get(v);
    if (text === undefined) {
      text = JSON.stringify(v);
      if (escaping) text = escapeAboveLatin1(text);
      kept.set(v, text);
    }
    pieces.push(text);
    return MARK;
  });
  const skeleton = escaping ? escapeAboveLatin1(plain) : plain;
  if (pieces.length === 0) return skeleton;
  // The marker's JSON text: a quoted string with the NUL escaped.
  const marker = JSON.stringify(MARK);
  const parts = skeleton.split(marker);
  // A text of the user's that happens to equal the marker: write it the plain way.
  if (parts.length !== pieces.length + 1) return escaping ? escapeAboveLatin1(JSON.stringify(value)) : JSON.stringify(value);
  const out: string[] = [parts[0]];
  for (let i = 1; i < parts.length; i++) out.push(pieces[i - 1], parts[i]);
  return out.join('');
}

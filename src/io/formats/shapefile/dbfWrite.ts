import type { DbfField } from './dbfRead';

type Cell = string | number | boolean | null | undefined;

const MAX_TEXT_BYTES = 254;

/**
 * Short names of our own for every plot-file and site-layer property longer than the 10
 * characters a dBASE field name holds, readable in a GIS attribute table; the shapefile zip's
 * CAUTION.txt lists them with the full names.
 */
export const DBF_SHORT_NAMES: Readonly<Record<string, string>> = {
  stratum_code: 'strat_code',
  field_state: 'fld_state',
  nearest_exclusion_m: 'near_ex_m',
  nearest_exclusion_kind: 'near_ex_kd',
  design_density_per_ha: 'dens_ha',
  access_point: 'access_pt',
  bearing_true_deg: 'brg_true',
  bearing_mag_deg: 'brg_mag',
  declination_deg: 'decl_deg',
  reject_reason: 'rej_reason',
  rejected_at: 'rej_at',
  exclusion_id: 'excl_id',
};

/**
 * DBF column names (≤ 10 bytes, ASCII letters, digits and _) for property keys, unique and
 * stable: our own long properties get the short names of {@link DBF_SHORT_NAMES}
 * (nearest_exclusion_m → near_ex_m); long keys of the user's own data are cut to 10 characters,
 * and clashes get a numeric tail ("field_name", "field_nam2").
 * dBASE III PLUS field names are limited to 10 characters.
 */
export function dbfFieldNames(keys: string[]): Map<string, string> {
  const out = new Map<string, string>();
  const used = new Set<string>();
  for (const key of keys) {
    if (out.has(key)) continue;
    const base = DBF_SHORT_NAMES[key] ?? (key.replace(/[^A-Za-z0-9_]/g, '_').replace(/^([^A-Za-z])/, 'f$1').slice(0, 10) || 'field');
    let name = base;
    for (let i = 2; used.has(name.toLowerCase()); i++) name = base.slice(0, 10 - String(i).length) + i;
    used.add(name.toLowerCase());
    out.set(key, name);
  }
  return out;
}

function cutUtf8(bytes: Uint8Array, max: number): Uint8Array {
  if (bytes.length <= max) return bytes;
  let end = max;
  while (end > 0 && (bytes[end] & 0xc0) === 0x80) end--;
  return bytes.subarray(0, end);
}

/** Digits after the point in JavaScript's shortest text of `v` (0 for exponent notation), at most 15. */
function fractionDigits(v: number): number {
  const s = String(v);
  const dot = s.indexOf('.');
  return dot < 0 || s.includes('e') ? 0 : Math.min(15, s.length - dot - 1);
}

/**
 * Writes rows as a dBASE III table with UTF-8 text (pair it with a .cpg saying UTF-8). Column
 * types follow the values: all numbers → N (each value as its shortest exact text, so it reads
 * back as the same double), all booleans → L, otherwise C (objects as JSON). Text longer
 * than 254 bytes, the C-field limit, is cut at a character boundary. Keys map to names through
 * {@link dbfFieldNames}. Format: dBASE III PLUS file structure (Ashton-Tate 1985).
 * @param date Last-update date stored in the header.
 */
export function dbfWrite(rows: Record<string, unknown>[], keys: string[], date: Date = new Date()): Uint8Array {
  const names = dbfFieldNames(keys);
  const enc = new TextEncoder();
  const fields: DbfField[] = [];
  const cells: Uint8Array[][] = rows.map(() => []);
  for (const key of keys) {
    const values = rows.map((r) => r[key] as Cell);
    const present = values.filter((v) => v !== null && v !== undefined);
    let field: DbfField;
    let texts: (string | Uint8Array)[];
    if (present.length > 0 && present.every((v) => typeof v === 'number' && Number.isFinite(v))) {
      // Each value is written as its shortest exact text (exponent form for tiny or huge values,
      // which readers parse with atof); the header's decimal count is for display only.
      const decimals = Math.max(...(present as number[]).map(fractionDigits));
      texts = values.map((v) => (typeof v === 'number' ? String(v) : ''));
      const length = Math.min(254, Math.max(1, ...texts.map((t) => (t as string).length)));
      field = { name: names.get(key)!, type: 'N', length, decimals };
      texts = texts.map((t) => (t as string).padStart(length, ' '));
    } else if (present.length > 0 && present.every((v) => typeof v === 'boolean')) {
      field = { name: names.get(key)!, type: 'L', length: 1, decimals: 0 };
      texts = values.map((v) => (v === true ? 'T' : v === false ? 'F' : '?'));
    } else {
      const encoded = values.map((v) => {
        if (v === null || v === undefined) return new Uint8Array(0);
        const s = typeof v === 'object' ? JSON.stringify(v) : String(v);
        return cutUtf8(enc.encode(s), MAX_TEXT_BYTES);
      });
      const length = Math.max(1, ...encoded.map((b) => b.length));
      field = { name: names.get(key)!, type: 'C', length, decimals: 0 };
      texts = encoded;
    }
    fields.push(field);
    texts.forEach((t, i) => {
      const cell = new Uint8Array(field.length).fill(0x20);
      cell.set(typeof t === 'string' ? enc.encode(t) : t);
      cells[i].push(cell);
    });
  }
  const headerLen = 32 + 32 * fields.length + 1;
  const recordLen = 1 + fields.reduce((s, f) => s + f.length, 0);
  const out = new Uint8Array(headerLen + recordLen * rows.length + 1);
  const view = new DataView(out.buffer);
  out[0] = 0x03;
  out[1] = date.getUTCFullYear() - 1900;
  out[2] = date.getUTCMonth() + 1;
  out[3] = date.getUTCDate();
  view.setUint32(4, rows.length, true);
  view.setUint16(8, headerLen, true);
  view.setUint16(10, recordLen, true);
  fields.forEach((f, i) => {
    const at = 32 + 32 * i;
    out.set(enc.encode(f.name), at);
    out[at + 11] = f.type.charCodeAt(0);
    out[at + 16] = f.length;
    out[at + 17] = f.decimals;
  });
  out[headerLen - 1] = 0x0d;
  let at = headerLen;
  for (const rowCells of cells) {
    out[at++] = 0x20;
    for (const c of rowCells) {
      out.set(c, at);
      at += c.length;
    }
  }
  out[at] = 0x1a;
  return out;
}

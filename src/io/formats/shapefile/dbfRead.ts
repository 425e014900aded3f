import { InputError } from '../../../core/common/InputError';
import { textDecoderFor } from '../../common/textDecoderFor';

/** One column of a dBASE table. */
export interface DbfField {
  name: string;
  type: string;
  length: number;
  decimals: number;
}

/** Rows of a dBASE table; a deleted record is null so rows stay aligned with shapefile records. */
export interface DbfTable {
  fields: DbfField[];
  rows: (Record<string, string | number | boolean | null> | null)[];
}

const CPG_ALIASES: Record<string, string> = {
  utf8: 'utf-8',
  'utf-8': 'utf-8',
  '65001': 'utf-8',
  '1252': 'windows-1252',
  ansi1252: 'windows-1252',
  cp1252: 'windows-1252',
  'windows-1252': 'windows-1252',
  '88591': 'iso-8859-1',
  'iso-8859-1': 'iso-8859-1',
  'iso88591': 'iso-8859-1',
  latin1: 'iso-8859-1',
  '1250': 'windows-1250',
  '1251': 'windows-1251',
  '437': 'ibm437',
  '850': 'ibm850',
  '936': 'gbk',
  gbk: 'gbk',
  '932': 'shift_jis',
  sjis: 'shift_jis',
};

/**
 * TextDecoder label for a .cpg text or an encoding option ("UTF-8", "1252", "ANSI 1252",
 * "latin1"...). Throws InputError naming `where` when the runtime has no such decoder.
 */
export function dbfEncodingLabel(text: string, where: string): string {
  const key = text.trim().toLowerCase().replace(/\s+/g, '');
  const label = CPG_ALIASES[key] ?? CPG_ALIASES[key.replace(/^ansi/, '')] ?? key;
  try {
    textDecoderFor(label);
  } catch {
    throw new InputError(`${where}: unknown text encoding "${text.trim()}" (try utf-8, windows-1252 or latin1)`);
  }
  return label;
}

/**
 * Reads a dBASE III/IV table (.dbf) as written beside shapefiles. Text is decoded with
 * `encoding`; without one, as strict UTF-8, and text that is not valid UTF-8 is refused with a
 * message asking for the encoding rather than shown garbled. Types: C text, N/F numbers (blank →
 * null), L logical, D dates as "YYYY-MM-DD"; others kept as text.
 * Format: dBASE III PLUS file structure (Ashton-Tate 1985; as documented at dbase.com "Xbase file
 * format"). Throws InputError naming `where` for a truncated or malformed table.
 */
export function dbfRead(bytes: Uint8Array, where: string, encoding?: string): DbfTable {
  if (bytes.length < 33) throw new InputError(`${where}: the .dbf file is too short to be a dBASE table`);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const records = view.getUint32(4, true);
  const headerLen = view.getUint16(8, true);
  const recordLen = view.getUint16(10, true);
  if (headerLen > bytes.length || headerLen < 33) throw new InputError(`${where}: the .dbf header is damaged (header length ${headerLen})`);
  const decoder = textDecoderFor(encoding ?? 'utf-8', !encoding);
  const decode = (from: number, to: number, row: number, field: string): string => {
    try {
      return decoder(bytes.subarray(from, to));
    } catch {
      throw new InputError(
        `${where}: record ${row + 1}, field ${field}: text is not UTF-8 and there is no .cpg file; ` +
          'give the encoding of the .dbf (e.g. --encoding windows-1252)',
      );
    }
  };
  const fields: DbfField[] = [];
  let offset = 32;
  while (offset + 32 <= headerLen && bytes[offset] !== 0x0d) {
    let end = offset;
    while (end < offset + 11 && bytes[end] !== 0) end++;
    const name = decode(offset, end, -1, `#${fields.length + 1}`).trim();
    fields.push({ name, type: String.fromCharCode(bytes[offset + 11]), length: bytes[offset + 16], decimals: bytes[offset + 17] });
    offset += 32;
  }
  let fieldBytes = fields.reduce((n, f) => n + f.length, 0);
  if (recordLen !== 1 + fieldBytes) {
    // Clipper and FoxPro write text fields longer than 255 bytes with the high byte in the decimals byte.
    const wide = fields.map((f) => (f.type === 'C' ? { ...f, length: f.length + 256 * f.decimals, decimals: 0 } : f));
    const wideBytes = wide.reduce((n, f) => n + f.length, 0);
    if (recordLen === 1 + wideBytes) {
      fields.splice(0, fields.length, ...wide);
      fieldBytes = wideBytes;
    }
  }
  // Each record is a deletion flag byte and the fields; any other record length misaligns every row.
  if (recordLen !== 1 + fieldBytes) {
    throw new InputError(`${where}: the .dbf header gives records of ${recordLen} bytes, but its ${fields.length} fields take ${1 + fieldBytes} (with the deletion flag); the table is damaged`);
  }
  const room = Math.floor((bytes.length - headerLen) / recordLen);
  if (records > room) {
    throw new InputError(`${where}: the .dbf header says ${records} records, but the file holds only ${room} (it is truncated or its header is damaged)`);
  }
  const rows: DbfTable['rows'] = [];
  for (let r = 0; r < records; r++) {
    const start = headerLen + r * recordLen;
    if (bytes[start] === 0x2a) {
      rows.push(null);
      continue;
    }
    const row: Record<string, string | number | boolean | null> = {};
    let at = start + 1;
    for (const f of fields) {
      const raw = decode(at, at + f.length, r, f.name);
      at += f.length;
      row[f.name] = dbfValue(raw, f.type);
    }
    rows.push(row);
  }
  return { fields, rows };
}

function dbfValue(raw: string, type: string): string | number | boolean | null {
  const text = raw.replace(/[\0 ]+$/, '');
  switch (type) {
    case 'N':
    case 'F': {
      const t = text.trim();
      if (!t || /^\*+$/.test(t)) return null;
      const n = Number(t);
      return Number.isFinite(n) ? n : null;
    }
    case 'L':
      if (/^[TtYy]/.test(text)) return true;
      if (/^[FfNn]/.test(text)) return false;
      return null;
    case 'D':
      return /^\d{8}$/.test(text.trim()) ? `${text.slice(0, 4)}-${text.slice(4, 6)}-${text.slice(6, 8)}` : null;
    default:
      return text === '' ? null : text;
  }
}

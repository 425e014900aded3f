import { InputError } from '../../core/common/InputError';
import type { DecimalMark } from '../../core/results/resultsCellParse';
import type { ResultsRow, ResultsTable } from '../../core/results/resultsCheck';

const DELIMITERS = [';', ',', '\t'] as const;
type Delimiter = (typeof DELIMITERS)[number];

/** Splits CSV text into records (RFC 4180 quoting), each with the line it starts on. */
function csvRecords(text: string, delimiter: Delimiter, fileName: string): { line: number; fields: string[] }[] {
  const records: { line: number; fields: string[] }[] = [];
  let fields: string[] = [];
  let field = '';
  let quoted = false;
  let line = 1;
  let start = 1;
  let i = 0;
  while (i < text.length) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
        continue;
      }
      if (c === '"') quoted = false;
      else {
        if (c === '\n') line += 1;
        field += c;
      }
      i += 1;
      continue;
    }
    if (c === '"' && field.trim() === '') {
      quoted = true;
      field = '';
    } else if (c === delimiter) {
      fields.push(field);
      field = '';
    } else if (c === '\n' || c === '\r') {
      fields.push(field);
      records.push({ line: start, fields });
      fields = [];
      field = '';
      if (c === '\r' && text[i + 1] === '\n') i += 1;
      line += 1;
      start = line;
    } else field += c;
    i += 1;
  }
  if (quoted) throw new InputError(`${fileName} row ${start}: a quoted field is never closed`);
  if (field !== '' || fields.length > 0) {
    fields.push(field);
    records.push({ line: start, fields });
  }
  return records.filter((r) => r.fields.some((f) => f.trim() !== ''));
}

/** The delimiter used most in the header line, outside quotes; semicolon wins a tie (decimal commas). */
function detectDelimiter(text: string): Delimiter {
  const end = text.search(/\r|\n/);
  const header = (end < 0 ? text : text.slice(0, end)).replace(/"[^"]*"/g, '');
  let best: Delimiter = ',';
  let bestCount = 0;
  for (const d of DELIMITERS) {
    const count = header.split(d).length - 1;
    if (count > bestCount) {
      best = d;
      bestCount = count;
    }
  }
  return best;
}

const COMMA_DECIMAL = /^[+-]?\d*,\d+%?$/;
const POINT_DECIMAL = /^[+-]?\d*\.\d+%?$/;

/** Decimal comma when some cells use it and none use a decimal point; both → an error naming one of each. */
function detectDecimal(records: { line: number; fields: string[] }[], columns: string[], fileName: string): DecimalMark {
  let comma: string | null = null;
  let point: string | null = null;
  for (const r of records) {
    r.fields.forEach((f, j) => {
      const t = f.trim();
      if (comma === null && COMMA_DECIMAL.test(t)) comma = `row ${r.line}, column ${columns[j]} ("${t}")`;
      if (point === null && POINT_DECIMAL.test(t)) point = `row ${r.line}, column ${columns[j]} ("${t}")`;
    });
  }
  if (comma !== null && point !== null) {
    throw new InputError(`${fileName}: mixes decimal commas (${comma}) and decimal points (${point}); use one decimal mark throughout`);
  }
  return comma !== null ? ',' : '.';
}

/**
 * Reads a results table exported from a spreadsheet: comma, semicolon or tab delimited (detected
 * from the header), UTF-8 with or without a byte-order mark, decimal point or decimal comma
 * (detected per file), RFC 4180 quoting. Cells stay text; the checks convert them.
 * @param fileName shown in messages
 * @param bytes the file's bytes (or already decoded text)
 * @param options idColumn: the column holding plot ids (default `plot_id`)
 * @throws InputError for an empty file, a missing id column, repeated column names, rows with the
 *   wrong number of fields, an unclosed quote, mixed decimal marks, or bytes that are not UTF-8
 */
export function parseResultsCsv(fileName: string, bytes: Uint8Array | string, options: { idColumn?: string } = {}): ResultsTable {
  let text: string;
  if (typeof bytes === 'string') text = bytes;
  else {
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    } catch {
      throw new InputError(`${fileName}: not UTF-8 text; save it from the spreadsheet as "CSV UTF-8"`);
    }
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  const delimiter = detectDelimiter(text);
  const records = csvRecords(text, delimiter, fileName);
  if (records.length === 0) throw new InputError(`${fileName}: the file is empty`);
  const [head, ...body] = records;
  const columns = head.fields.map((c) => c.trim());
  const seen = new Map<string, number>();
  columns.forEach((c, j) => {
    if (c === '') throw new InputError(`${fileName} row ${head.line}: column ${j + 1} has no name`);
    if (seen.has(c)) throw new InputError(`${fileName} row ${head.line}: column name "${c}" appears twice`);
    seen.set(c, j);
  });
  const idColumn = options.idColumn ?? 'plot_id';
  if (!seen.has(idColumn)) {
    throw new InputError(`${fileName}: no column "${idColumn}" for plot ids; columns are ${columns.join(', ')} (choose one with --id-column)`);
  }
  for (const r of body) {
    if (r.fields.length !== columns.length) {
      throw new InputError(`${fileName} row ${r.line}: ${r.fields.length} fields, but the header has ${columns.length}`);
    }
  }
  const decimal = detectDecimal(body, columns, fileName);
  const rows: ResultsRow[] = body.map((r) => {
    const cells: Record<string, string> = {};
    columns.forEach((c, j) => {
      cells[c] = r.fields[j];
    });
    return { row: r.line, cells };
  });
  return { fileName, columns, idColumn, delimiter, decimal, rows };
}

import type { ResultKind } from '../core/model/designTypes';
import { RESULTS_REPLACED_BY_COLUMN, RESULTS_STATUS_COLUMN, type ResultsTable } from '../core/results/resultsCheck';
import type { PlotCollection } from '../core/model/designTypes';
import type { Problem } from '../core/model/types';

/** Which results columns mean what; every other column is a variable of the given kind. */
export interface ResultsMapping {
  idColumn: string;
  statusColumn: string | null;
  replacedByColumn: string | null;
  kinds: Record<string, ResultKind>;
}

/** The column holding the most ids of the plot file (ties: plot_id, then the leftmost). */
export function idColumnGuess(table: ResultsTable, collection: PlotCollection): string {
  const ids = new Set(collection.features.map((f) => f.properties.plot_id));
  let best = table.columns.includes('plot_id') ? 'plot_id' : table.columns[0];
  let bestHits = -1;
  for (const c of table.columns) {
    const hits = table.rows.reduce((a, r) => a + (ids.has((r.cells[c] ?? '').trim()) ? 1 : 0), 0);
    if (hits > bestHits || (hits === bestHits && c === 'plot_id')) {
      best = c;
      bestHits = hits;
    }
  }
  return best;
}

/** The first line's names, split on its most used delimiter: only to find some column to parse with. */
export function headerNames(bytes: Uint8Array | string): string[] {
  const text = (typeof bytes === 'string' ? bytes : new TextDecoder().decode(bytes)).replace(/^\uFEFF/, '');
  const line = text.split(/\r?\n/, 1)[0] ?? '';
  const d = [';', ',', '\t'].reduce((a, b) => (line.split(b).length > line.split(a).length ? b : a), ',');
  return line.split(d).map((c) => c.trim().replace(/^"|"$/g, ''));
}

/**
 * The table as the core reads it: the chosen status and replacement columns under the names the
 * checks know, and any other column carrying one of those names moved aside so it is not read.
 */
export function tableForCore(t: ResultsTable, m: ResultsMapping): { table: ResultsTable; coreName: (c: string) => string } {
  const rename = new Map<string, string>();
  if (m.statusColumn) rename.set(m.statusColumn, RESULTS_STATUS_COLUMN);
  if (m.replacedByColumn) rename.set(m.replacedByColumn, RESULTS_REPLACED_BY_COLUMN);
  const reserved = new Set([RESULTS_STATUS_COLUMN, RESULTS_REPLACED_BY_COLUMN]);
  const coreName = (c: string) => rename.get(c) ?? (reserved.has(c) ? `${c} (not used)` : c);
  const rows = t.rows.map((r) => ({ row: r.row, cells: Object.fromEntries(Object.entries(r.cells).map(([c, v]) => [coreName(c), v])) }));
  return { table: { ...t, columns: t.columns.map(coreName), idColumn: coreName(m.idColumn), rows }, coreName };
}

/** Puts the user's column names back into problems the core worded with its own names. */
export function problemsInUserNames(problems: Problem[], m: ResultsMapping): Problem[] {
  const back: [string, string | null][] = [
    [RESULTS_STATUS_COLUMN, m.statusColumn],
    [RESULTS_REPLACED_BY_COLUMN, m.replacedByColumn],
  ];
  return problems.map((p) => {
    let message = p.message;
    let column = p.where.column;
    for (const [core, user] of back) {
      if (!user || user === core) continue;
      message = message.split(`column ${core}:`).join(`column ${user}:`).split(`rejected plot's ${core}`).join(`rejected plot's ${user}`);
      if (column === core) column = user;
    }
    return { ...p, message, where: { ...p.where, column } };
  });
}

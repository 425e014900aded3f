import { plotFieldStates } from '../../core/field/plotFieldState';
import { fieldVariableResultKind } from '../../core/results/fieldValueCheck';
import { FIELD_RESULTS_FIXED_COLUMNS } from '../../core/field/fieldVariablesCheck';
import type { PlotCollection } from '../../core/model/designTypes';
import type { FieldVariable } from '../../core/model/fieldTypes';
import { resultsValueRead } from '../../core/results/resultsValueRead';
import Papa from 'papaparse';
import { csvCell } from '../common/csvCell';

/**
 * The results table of a walked plan, as the Results step and `stratplot estimate` read it: one
 * row per plot to visit and per rejected plot (waiting reserves have no row), with the field state
 * in `status` (done when visited, rejected, or blank when not reached yet) and `replaced_by`, the
 * visit's time, crew and position, one column per field variable and the crew's note. Numbers the
 * checks accept are written as numbers; anything else as typed (the results checks then name it).
 * Comma-delimited with a decimal point; text cells quoted when needed (RFC 4180) and guarded
 * against spreadsheet formulas (csvCell). `collection` is named as files are (plotCollectionNamed).
 */
export function fieldResultsToCsv(collection: PlotCollection, variables: readonly FieldVariable[]): string {
  const plots = collection.features.map((f) => f.properties);
  const states = plotFieldStates(plots);
  const header = [...FIELD_RESULTS_FIXED_COLUMNS.filter((c) => c !== 'crew_note'), ...variables.map((v) => v.name), 'crew_note'];
  const data: (string | number)[][] = [];
  for (const p of plots) {
    const s = states.get(p.plot_id);
    if (!s || s.key === 'reserve') continue;
    const status = s.key === 'rejected' ? 'rejected' : p.visited_at ? 'done' : '';
    const values = variables.map((v) => {
      const typed = p.field_values?.[v.name] ?? '';
      const kind = fieldVariableResultKind(v.kind);
      if (s.key === 'rejected' || typed === '') return '';
      const read = kind ? resultsValueRead(typed, kind, '.') : null;
      return read?.ok && read.value !== null && kind !== 'presence' ? read.value : typed;
    });
    const row: (string | number | undefined)[] = [
      p.plot_id,
      p.stratum,
      p.role,
      status,
      s.key === 'rejected' ? (s.replacedBy ?? '') : '',
      s.key === 'rejected' ? s.reason : '',
      p.visited_at,
      p.visited_by,
      p.visit_lat,
      p.visit_lon,
      p.visit_accuracy_m,
      ...values,
      p.crew_note,
    ];
    data.push(row.map(csvCell));
  }
  // Written as the plot table is (featuresToCsv): papaparse quotes where RFC 4180 needs it.
  return `${Papa.unparse({ fields: header.map((h) => String(csvCell(h))), data }, { newline: '\r\n', escapeFormulae: false, quotes: false })}\r\n`;
}

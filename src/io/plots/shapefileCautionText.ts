import type { PlotCollection } from '../../core/model/designTypes';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { PLOT_FIELD_STATE_KEYS, plotRejectionLines } from '../../core/field/plotFieldState';
import { PLOT_SYMBOLS } from '../../core/field/plotSymbols';
import { shapefileFieldNames } from '../formats/shapefile/featuresToShapefileZip';
import type { NamedLayer } from './siteLayers';

function wrap(text: string, width = 96): string[] {
  const lines: string[] = [];
  let line = '';
  for (const word of text.split(/\s+/)) {
    if (line && line.length + 1 + word.length > width) {
      lines.push(line);
      line = word;
    } else line = line ? `${line} ${word}` : word;
  }
  if (line) lines.push(line);
  return lines;
}

/**
 * The CAUTION.txt that goes into every shapefile zip (plain text, CRLF, so any program opens it):
 * the safety caution, the field decisions recorded (rejected plots with reason, time and
 * replacement), what the plot field states mean, and for each .dbf the full name of every field
 * whose shapefile name is shorter (dBASE field names hold at most 10 characters).
 */
export function shapefileCautionText(siteName: string, collection: PlotCollection, layers: readonly NamedLayer[]): string {
  const out: string[] = [`${siteName}: field files from stratplot (zipped shapefiles, WGS84 longitude/latitude, UTF-8 text)`, ''];
  out.push('CAUTION', ...wrap(FIELD_CAUTION), '');
  const decisions = plotRejectionLines(collection);
  out.push('FIELD DECISIONS', ...(decisions.length ? decisions.flatMap((d) => wrap(`- ${d}`)) : ['None recorded: every primary plot is to be visited.']), '');
  out.push('PLOT FIELD STATES (field fld_state; field_note says what to do)');
  for (const k of PLOT_FIELD_STATE_KEYS) out.push(`  ${k.padEnd(10)} ${PLOT_SYMBOLS[k].label}`);
  out.push('');
  out.push('FIELD NAMES (a shapefile field name holds at most 10 characters; full names below)');
  for (const layer of layers) {
    for (const { file, names } of shapefileFieldNames(layer.features, layer.name)) {
      const short = [...names].filter(([full, name]) => full !== name);
      out.push(`${file}.dbf:`, ...(short.length ? short.map(([full, name]) => `  ${name.padEnd(10)} ${full}`) : ['  (every field keeps its full name)']));
    }
  }
  return `${out.join('\r\n')}\r\n`;
}

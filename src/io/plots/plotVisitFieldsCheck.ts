import { InputError } from '../../core/common/InputError';
import { MAX_FIELD_VARIABLES, MAX_NOTE_LENGTH } from '../../core/common/inputLimits';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

/**
 * Checks the visit record a crew left on each plot of a plot or plan file (see plotVisit):
 * `visited_at` a date, `visited_by` and `crew_note` text of at most MAX_NOTE_LENGTH characters,
 * the visit position within WGS84 ranges with a non-negative accuracy, and `field_values` an object
 * of at most MAX_FIELD_VARIABLES text values. Plots without these fields pass.
 * @throws InputError naming the file, the feature index and plot id, and the field.
 */
export function plotVisitFieldsCheck(features: readonly unknown[], fileName: string): void {
  features.forEach((f, i) => {
    const p = isObject(f) && isObject(f.properties) ? f.properties : null;
    if (!p) return;
    const at = `${fileName}: feature ${i} (${String(p.plot_id).slice(0, 100)})`;
    const text = (key: string) => {
      const v = p[key];
      if (v === undefined) return;
      if (typeof v !== 'string') throw new InputError(`${at}: ${key} must be text`);
      if (v.length > MAX_NOTE_LENGTH) throw new InputError(`${at}: ${key} is longer than ${MAX_NOTE_LENGTH} characters`);
    };
    text('visited_at');
    text('visited_by');
    text('crew_note');
    if (typeof p.visited_at === 'string' && Number.isNaN(new Date(p.visited_at).getTime())) throw new InputError(`${at}: visited_at "${p.visited_at.slice(0, 40)}" is not a date`);
    const ranges: [string, number][] = [
      ['visit_lon', 180],
      ['visit_lat', 90],
      ['visit_accuracy_m', 1e7],
    ];
    for (const [key, max] of ranges) {
      const v = p[key];
      if (v === undefined) continue;
      if (typeof v !== 'number' || !(Math.abs(v) <= max) || (key === 'visit_accuracy_m' && v < 0)) throw new InputError(`${at}: ${key} ${JSON.stringify(v)} is out of range`);
    }
    const values = p.field_values;
    if (values === undefined) return;
    if (!isObject(values)) throw new InputError(`${at}: field_values must be an object of measurements by variable name`);
    const entries = Object.entries(values);
    if (entries.length > MAX_FIELD_VARIABLES) throw new InputError(`${at}: field_values holds ${entries.length} values; at most ${MAX_FIELD_VARIABLES}`);
    for (const [name, v] of entries) {
      if (typeof v !== 'string') throw new InputError(`${at}: field_values "${name.slice(0, 60)}" must be text as typed`);
      if (v.length > MAX_NOTE_LENGTH || name.length > MAX_NOTE_LENGTH) throw new InputError(`${at}: field_values "${name.slice(0, 60)}" is longer than ${MAX_NOTE_LENGTH} characters`);
    }
  });
}

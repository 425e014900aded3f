import { InputError } from '../common/InputError';
import { MAX_FIELD_VARIABLES, MAX_NAME_LENGTH } from '../common/inputLimits';
import { FIELD_VARIABLE_KINDS, type FieldVariable } from '../model/fieldTypes';

/**
 * The columns the field results table always has, before the plan's variables: a variable may
 * not take one of these names (the Results step and `stratplot estimate` read them by name).
 */
export const FIELD_RESULTS_FIXED_COLUMNS = [
  'plot_id',
  'stratum',
  'role',
  'status',
  'replaced_by',
  'reject_reason',
  'visited_at',
  'visited_by',
  'visit_lat',
  'visit_lon',
  'visit_accuracy_m',
  'crew_note',
] as const;

/**
 * Checks the variables a plan asks crews to measure: each has a name of at most MAX_NAME_LENGTH
 * characters that no other variable (in any case) or fixed results column uses, and a known kind;
 * at most MAX_FIELD_VARIABLES of them.
 * @throws InputError naming the variable (by position and name) and what is wrong.
 */
export function fieldVariablesCheck(variables: readonly FieldVariable[], where = 'field variables'): FieldVariable[] {
  if (variables.length > MAX_FIELD_VARIABLES) throw new InputError(`${where}: ${variables.length} variables; at most ${MAX_FIELD_VARIABLES} can be recorded per plot`);
  const seen = new Map<string, number>();
  const fixed = new Set<string>(FIELD_RESULTS_FIXED_COLUMNS);
  return variables.map((v, i) => {
    const name = typeof v?.name === 'string' ? v.name.trim() : '';
    const at = `${where}, variable ${i + 1}${name ? ` ("${name.slice(0, 60)}")` : ''}`;
    if (!name) throw new InputError(`${at}: give it a name`);
    if (name.length > MAX_NAME_LENGTH) throw new InputError(`${at}: the name is longer than ${MAX_NAME_LENGTH} characters`);
    if (fixed.has(name.toLowerCase())) throw new InputError(`${at}: "${name}" is a column the results table always has; choose another name`);
    const first = seen.get(name.toLowerCase());
    if (first !== undefined) throw new InputError(`${at}: the same name as variable ${first + 1}`);
    seen.set(name.toLowerCase(), i);
    if (!(FIELD_VARIABLE_KINDS as readonly string[]).includes(v.kind)) {
      throw new InputError(`${at}: kind ${JSON.stringify(v.kind)} is not one of ${FIELD_VARIABLE_KINDS.join(', ')}`);
    }
    return { name, kind: v.kind };
  });
}

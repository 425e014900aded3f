import { InputError } from '../core/common/InputError';
import { MAX_BUFFER_M, MAX_NOTE_LENGTH } from '../core/common/inputLimits';
import { fieldVariablesCheck } from '../core/field/fieldVariablesCheck';
import { FIELD_SETUP_EMPTY, type FieldSetup } from '../core/model/fieldTypes';

/**
 * Reads the `field` member of a plan file: the crew name (text), the variables (fieldVariablesCheck)
 * and the arrival radius (a distance above 0 and at most MAX_BUFFER_M metres).
 * @throws InputError naming the file and the member.
 */
export function fieldSetupRead(data: unknown, fileName: string): FieldSetup {
  if (typeof data !== 'object' || data === null || Array.isArray(data)) throw new InputError(`${fileName}: "field" must be an object`);
  const f = data as Record<string, unknown>;
  const crew = f.crew ?? '';
  if (typeof crew !== 'string' || crew.length > MAX_NOTE_LENGTH) throw new InputError(`${fileName}: field.crew must be text of at most ${MAX_NOTE_LENGTH} characters`);
  const variables = f.variables ?? [];
  if (!Array.isArray(variables)) throw new InputError(`${fileName}: field.variables must be a list`);
  const radius = f.arrivalRadiusM ?? FIELD_SETUP_EMPTY.arrivalRadiusM;
  if (typeof radius !== 'number' || !(radius > 0 && radius <= MAX_BUFFER_M)) {
    throw new InputError(`${fileName}: field.arrivalRadiusM must be a distance above 0 and at most ${MAX_BUFFER_M} m, got ${JSON.stringify(radius)}`);
  }
  return { crew, variables: fieldVariablesCheck(variables, `${fileName}: field`), arrivalRadiusM: radius };
}

import { MAX_NOTE_LENGTH } from '../common/inputLimits';
import type { ResultKind } from '../model/designTypes';
import type { FieldVariable, FieldVariableKind } from '../model/fieldTypes';
import { resultsValueRead } from './resultsValueRead';

/** The results kind whose checks a field variable shares; null for free text (not estimated). */
export function fieldVariableResultKind(kind: FieldVariableKind): ResultKind | null {
  switch (kind) {
    case 'number':
      return 'measure';
    case 'percent':
      return 'cover';
    case 'count':
      return 'count';
    case 'presence':
      return 'presence';
    case 'text':
      return null;
  }
}

/**
 * What is wrong with a value typed into the plot form, in the words the results checks use
 * (so the crew sees on site what the Results step would refuse), or null when it can be kept.
 * Blank is allowed: a plot may be recorded in several sittings.
 */
export function fieldValueCheck(variable: FieldVariable, text: string): string | null {
  if (text.length > MAX_NOTE_LENGTH) return `${variable.name}: longer than ${MAX_NOTE_LENGTH} characters`;
  const kind = fieldVariableResultKind(variable.kind);
  if (kind === null) return null;
  const read = resultsValueRead(text, kind, '.');
  return read.ok ? null : `${variable.name}: ${read.problem.replace(' (if the column is not a count, give --kind measure)', '')}`;
}

import { isInputError } from '../../core/common/InputError';
import { type RecaptureEstimate, recaptureEffectiveAreaHa, recaptureEstimate } from '../../core/results/recapture';
import type { RecaptureGridForm } from '../../state/resultsStore';

/** What a recapture form gives: nothing yet, a message saying which field is wrong, or the estimate. */
export type RecaptureFormResult = { state: 'empty' } | { state: 'error'; message: string } | { state: 'ok'; estimate: RecaptureEstimate };

function wholeField(label: string, text: string): number {
  const t = text.trim();
  if (!/^\d+$/.test(t)) throw new RecaptureFieldError(`${label} must be a whole number ≥ 0, got "${t}"`);
  return Number(t);
}

function numberField(label: string, text: string): number {
  const t = text.trim().replace(',', '.');
  const v = Number(t);
  if (t === '' || !Number.isFinite(v)) throw new RecaptureFieldError(`${label} must be a number, got "${text.trim()}"`);
  return v;
}

class RecaptureFieldError extends Error {}

/**
 * Works out one grid's recapture form: Petersen, Chapman, SE and 95 % CI from M, n and m, and the
 * density per ha over the effective area (grid plus boundary strip) when the grid's extent is
 * given. Blank extent fields mean "abundance only"; a strip is required once an extent is given.
 * Formulas and warnings are those of core/recapture (Seber 1982 ch. 3; Krebs 1989 ch. 2).
 */
export function recaptureFormResult(form: RecaptureGridForm): RecaptureFormResult {
  if (form.marked.trim() === '' && form.caught.trim() === '' && form.recaptured.trim() === '') return { state: 'empty' };
  try {
    const counts = {
      marked: wholeField('Marked M', form.marked),
      caught: wholeField('Caught n', form.caught),
      recaptured: wholeField('Recaptured m', form.recaptured),
    };
    const extentGiven = form.by === 'area' ? form.areaHa.trim() !== '' : [form.spacingM, form.rows, form.cols].some((t) => t.trim() !== '');
    let effectiveAreaHa: number | undefined;
    if (extentGiven) {
      if (form.stripM.trim() === '') throw new RecaptureFieldError('Strip width is needed with a grid extent (0 for no boundary strip)');
      const strip = numberField('Strip width', form.stripM);
      effectiveAreaHa =
        form.by === 'area'
          ? recaptureEffectiveAreaHa({ areaHa: numberField('Grid area', form.areaHa) }, strip)
          : recaptureEffectiveAreaHa({ spacingM: numberField('Station spacing', form.spacingM), rows: numberField('Rows', form.rows), cols: numberField('Columns', form.cols) }, strip);
    }
    return { state: 'ok', estimate: recaptureEstimate(counts, { effectiveAreaHa }) };
  } catch (e) {
    if (e instanceof RecaptureFieldError || isInputError(e)) return { state: 'error', message: `${form.name}: ${e.message}` };
    throw e;
  }
}

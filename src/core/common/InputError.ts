/**
 * A problem with what the user gave us (a file, a feature, an option), worded so it can be shown
 * as it is: what is wrong and where. The CLI prints it as one line and exits 2; the app shows it.
 */
export class InputError extends Error {
  override readonly name = 'InputError';
}

/** True for errors meant for the user rather than for a developer. */
export function isInputError(error: unknown): error is InputError {
  return error instanceof InputError || (error instanceof Error && error.name === 'InputError');
}

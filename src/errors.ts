/**
 * Errors a user can fix: bad input. The CLI prints `message` as one line and exits with status 2.
 * Every message names the file, the row or key, the field, the value and what is allowed.
 */
export class InputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InputError';
  }
}

export interface InputPlace {
  /** File path (as the user gave it) or a label such as `--period` for command-line flags. */
  file: string;
  /** `row 3 (line 4)`, a key path such as `constraints.maxAirmass`, or undefined for a flag. */
  where?: string;
  field: string;
  value: unknown;
  /** What is allowed, in plain words. */
  allowed: string;
}

/** Formats the single line shown to the user for a bad value. */
export function inputError(place: InputPlace): InputError {
  const where = place.where ? `: ${place.where}` : '';
  return new InputError(
    `${place.file}${where}: ${place.field} = ${showValue(place.value)}: ${place.allowed}`,
  );
}

function showValue(value: unknown): string {
  if (value === undefined) return '(missing)';
  if (value === '') return '(empty)';
  const text = typeof value === 'string' ? JSON.stringify(value) : JSON.stringify(value) ?? String(value);
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}

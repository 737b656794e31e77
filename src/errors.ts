/**
 * The errors Crest raises on purpose. Each message is one line. The CLI alone turns them into
 * exit codes (src/cli/main.ts): every CrestError exits with status 2, anything else is an
 * internal fault (status 1).
 */
export abstract class CrestError extends Error {
  constructor(message: string) {
    super(oneLine(message));
    this.name = new.target.name;
  }
}

/** Bad input a user can fix: a file, a row or key, a field, a value and what is allowed. */
export class InputError extends CrestError {}

/** An output that cannot be written: the `--out` folder, checked before any computation. */
export class OutputError extends CrestError {}

/** A core function called with values outside its domain (a library caller's mistake). */
export class ValidationError extends CrestError {}

export interface InputPlace {
  /** File path (as the user gave it) or a label such as `command line` for flags. */
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
  return new InputError(`${place.file}${where}: ${place.field} = ${showValue(place.value)}: ${place.allowed}`);
}

/** The one line for an output folder that cannot take the files: `--out = "x": why`. */
export function outputError(outDir: string, why: string): OutputError {
  return new OutputError(`command line: --out = ${showValue(outDir)}: ${why}`);
}

/** A core argument outside its domain: `name = value: allowed`. */
export function validationError(name: string, value: unknown, allowed: string): ValidationError {
  return new ValidationError(`${name} = ${showValue(value)}: ${allowed}`);
}

function showValue(value: unknown): string {
  if (value === undefined) return '(missing)';
  if (value === '') return '(empty)';
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  const text = JSON.stringify(value) ?? String(value);
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}

/** Library and system messages may hold line breaks; a Crest message never does. */
function oneLine(message: string): string {
  return message.replace(/\s*[\r\n]+\s*/g, ' ').trim();
}

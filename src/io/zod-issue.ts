import type { z } from 'zod';
import { inputError, type InputError } from '../errors.js';

/** Value at a key path inside parsed data, for the error line. */
export function valueAt(data: unknown, keyPath: readonly PropertyKey[]): unknown {
  let node: unknown = data;
  for (const key of keyPath) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<PropertyKey, unknown>)[key];
  }
  return node;
}

/** Key path as users write it: `constraints.maxAirmass`, `horizon[2].altitudeDeg`. */
export function keyPathText(keyPath: readonly PropertyKey[]): string {
  let text = '';
  for (const key of keyPath) {
    text += typeof key === 'number' ? `[${key}]` : text === '' ? String(key) : `.${String(key)}`;
  }
  return text || '(top level)';
}

/** Turns the first zod issue into the one-line error of a JSON/YAML file. */
export function issueToError(file: string, data: unknown, error: z.ZodError): InputError {
  const issue = error.issues[0]!;
  const keyPath = issue.path;
  const field = keyPathText(keyPath);
  let allowed = issue.message;
  if (issue.code === 'unrecognized_keys') {
    const key = issue.keys[0]!;
    return inputError({
      file,
      field: keyPathText([...keyPath, key]),
      value: valueAt(data, [...keyPath, key]),
      allowed: 'unknown key (check its spelling against the documented schema)',
    });
  }
  if (issue.code === 'invalid_type' && valueAt(data, keyPath) === undefined) allowed = `required: ${issue.message}`;
  if (keyPath.length === 0) allowed = 'a mapping of keys to values (a YAML mapping or a JSON object)';
  return inputError({ file, field, value: valueAt(data, keyPath), allowed });
}

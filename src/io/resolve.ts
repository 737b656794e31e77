import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { inputError } from '../errors.js';

/** Ids of the JSON files in a folder (file name without extension), sorted. */
export function listIds(dir: string): string[] {
  if (!existsSync(dir)) return [];
  return readdirSync(dir)
    .filter((name) => name.endsWith('.json'))
    .map((name) => name.slice(0, -'.json'.length))
    .sort();
}

/** A referenced path that names a file, else an input error at the key or flag that gave it. */
export function existingFile(resolved: string, ref: string, what: string, context: { file: string; field: string }): string {
  if (existsSync(resolved) && statSync(resolved).isFile()) return resolved;
  const problem = existsSync(resolved) ? 'is not a file' : 'does not exist';
  throw inputError({
    file: context.file,
    field: context.field,
    value: ref,
    allowed: `a ${what} file (${path.relative(process.cwd(), resolved) || resolved} ${problem})`,
  });
}

/**
 * A reference is either a path (contains a slash or a file extension) or an id of a bundled file.
 * `baseDir` resolves relative paths (the campaign file's folder).
 */
export function resolveRef(ref: string, bundledDir: string, what: string, context: { file: string; field: string; baseDir: string }): string {
  if (/[\\/]/.test(ref) || /\.(json|ya?ml)$/i.test(ref)) return existingFile(path.resolve(context.baseDir, ref), ref, what, context);
  const ids = listIds(bundledDir);
  if (ids.includes(ref)) return path.join(bundledDir, `${ref}.json`);
  throw inputError({
    file: context.file,
    field: context.field,
    value: ref,
    allowed: `unknown ${what} id; known: ${ids.join(', ')} (or give a path to a file)`,
  });
}

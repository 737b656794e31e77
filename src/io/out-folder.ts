import { existsSync, mkdirSync, realpathSync, rmSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { outputError } from '../errors.js';

/** Kernel and device trees: files there are not files, and writing may block or fail oddly. */
const NOT_A_DISK = ['/proc', '/sys', '/dev'];

const real = (p: string) => (existsSync(p) ? realpathSync(p) : path.resolve(p));

/** The nearest folder-or-file that exists, going up from `p`. */
function nearestExisting(p: string): string {
  let at = path.resolve(p);
  while (!existsSync(at) && path.dirname(at) !== at) at = path.dirname(at);
  return at;
}

/** A file-system error in a few words: its code, and what ENOSPC means. */
export function fileErrorReason(err: unknown): string {
  const e = err as NodeJS.ErrnoException;
  return e.code ? `${e.code}${e.code === 'ENOSPC' ? ', the disk is full' : ''}` : e.message;
}

/**
 * Checks, before any computation, that `outDir` can take the named files: it is (or can be
 * made) a folder on a disk, files can be written there, and no named output would replace an
 * input. Creates the folder. Each fault is one OutputError line; nothing here can block.
 */
export function checkOutFolder(outDir: string, names: string[], inputs: string[]): void {
  const existing = nearestExisting(outDir);
  const realExisting = realpathSync(existing);
  if (NOT_A_DISK.some((root) => realExisting === root || realExisting.startsWith(`${root}/`))) {
    throw outputError(outDir, `a folder on a disk, not under ${NOT_A_DISK.join(', ')}`);
  }
  if (!statSync(existing).isDirectory()) {
    const resolved = path.resolve(outDir);
    throw outputError(outDir, existing === resolved ? 'names an existing file; give a folder' : `lies under ${existing}, which is a file, not a folder`);
  }
  try {
    mkdirSync(outDir, { recursive: true });
    const probe = path.join(outDir, `.crest-probe-${process.pid}`);
    writeFileSync(probe, '');
    rmSync(probe);
  } catch (err) {
    throw outputError(outDir, `a folder Crest can write in (${fileErrorReason(err)})`);
  }
  const protectedPaths = new Set(inputs.map(real));
  for (const file of names.map((name) => path.join(outDir, name))) {
    if (protectedPaths.has(real(file))) throw outputError(outDir, `a folder where no input file would be overwritten (${file} is an input)`);
    if (existsSync(file) && !statSync(file).isFile()) throw outputError(outDir, `a folder where ${path.basename(file)} can be written (${file} is not a file)`);
  }
}

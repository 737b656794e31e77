import { mkdtempSync, readdirSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { hostname } from 'node:os';
import path from 'node:path';
import { outputError } from '../errors.js';
import { checkOutFolder, fileErrorReason } from './out-folder.js';

// All files of one run replace the old set as one step. They are written into a staging folder
// inside the out folder; renaming that folder to a commit name is the step (rename is atomic);
// then each file is renamed into place. A run killed before the commit leaves the old set and
// a staging folder, which the next run removes; one killed after it leaves a commit folder,
// which the next writer or reader of the folder finishes moving. Either way the folder ends up
// with the whole old set or the whole new one. Folder names carry the writer's pid and host, so
// on a folder shared between machines (map parts on a cluster) no run removes the staging folder
// of a run it cannot see; two runs finishing the same commit both end with the files in place.

const STAGING = '.crest-staging-';
const COMMIT = '.crest-commit-';

/** Points at which a test may stop the writer (it kills the process there). */
export type OutputStep = `staged ${string}` | 'committed' | `moved ${string}` | 'done';

export interface OutputSetOptions {
  /** Called after each step; tests kill the process here to check what a crash leaves. */
  afterStep?: (step: OutputStep) => void;
}

/** This machine's name as folder names carry it: letters, digits, dots and dashes only. */
const HOST = hostname().replace(/[^A-Za-z0-9.-]/g, '_');

/** The pid and host in a staging or commit folder's name (no host: a name of an older version, this machine). */
function writerOf(name: string): { pid: number; host: string } {
  const m = /^\.crest-(?:staging|commit)-(\d+)(?:@(.+))?-[^-]+$/.exec(name);
  return { pid: Number(m?.[1]), host: m?.[2] ?? HOST };
}

/** Whether a writer may still be running; one on another machine cannot be asked, so it may. */
function alive({ pid, host }: { pid: number; host: string }): boolean {
  if (host !== HOST || pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Moves every file of a commit folder into place and removes the folder. */
function finishCommit(outDir: string, commitDir: string, afterStep?: (step: OutputStep) => void): void {
  let names: string[];
  try {
    names = readdirSync(commitDir);
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'ENOENT') return; // another run finished it
    throw err;
  }
  for (const name of names) {
    try {
      renameSync(path.join(commitDir, name), path.join(outDir, name));
    } catch (err) {
      if ((err as NodeJS.ErrnoException).code !== 'ENOENT') throw err; // else another run moved it
    }
    afterStep?.(`moved ${name}`);
  }
  rmSync(commitDir, { recursive: true, force: true });
}

/**
 * Finishes or discards what an interrupted run left in `outDir`: committed sets are moved into
 * place, staging folders of runs no longer alive are removed. Does nothing if the folder is absent.
 */
export function recoverOutputSets(outDir: string): void {
  let names: string[];
  try {
    names = readdirSync(outDir);
  } catch {
    return;
  }
  try {
    for (const name of names.filter((n) => n.startsWith(COMMIT)).sort()) finishCommit(outDir, path.join(outDir, name));
    for (const name of names.filter((n) => n.startsWith(STAGING))) {
      if (!alive(writerOf(name))) rmSync(path.join(outDir, name), { recursive: true, force: true });
    }
  } catch (err) {
    throw outputError(outDir, `a folder where the files of an interrupted run can be put in place (${fileErrorReason(err)})`);
  }
}

/** The same for a reader: a folder it may not write in is read as it is. */
export function recoverBeforeReading(file: string): void {
  try {
    recoverOutputSets(path.dirname(file));
  } catch {
    // Left for the next writer; the reader sees the folder as it is.
  }
}

/**
 * Writes `files` (name → content) into `outDir` as one set, after the checks of checkOutFolder
 * (no input is replaced); returns the paths written. A file-system fault is one OutputError
 * line, and the old set stays in place.
 */
export function writeOutputSet(outDir: string, files: Record<string, string>, inputs: string[], options: OutputSetOptions = {}): string[] {
  const names = Object.keys(files);
  checkOutFolder(outDir, names, inputs);
  recoverOutputSets(outDir);
  const { afterStep } = options;
  let staging: string | undefined;
  let committed = false;
  let current = '';
  try {
    staging = mkdtempSync(path.join(outDir, `${STAGING}${process.pid}@${HOST}-`));
    for (const name of names) {
      current = name;
      writeFileSync(path.join(staging, name), files[name]!);
      afterStep?.(`staged ${name}`);
    }
    current = '';
    const commitDir = path.join(outDir, `${COMMIT}${path.basename(staging).slice(STAGING.length)}`);
    renameSync(staging, commitDir);
    staging = undefined;
    committed = true;
    afterStep?.('committed');
    finishCommit(outDir, commitDir, afterStep);
    afterStep?.('done');
  } catch (err) {
    if (staging) rmSync(staging, { recursive: true, force: true });
    const why = fileErrorReason(err);
    if (committed) throw outputError(outDir, `the new files could not all be moved into place (${why}); the next run in this folder finishes the move`);
    throw outputError(outDir, `${current ? `cannot write ${current}` : 'cannot stage the files'} (${why}); the files there are unchanged`);
  }
  return names.map((name) => path.join(outDir, name));
}

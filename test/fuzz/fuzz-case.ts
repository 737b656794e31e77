// One fuzz case: files written into a fresh folder, `crest ...args` run in-process, and the
// checks every run must pass whatever its input.
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { runMain, type MainResult } from '../support/run-main.js';

export interface FuzzCase {
  /** Files to write (name → content) into the case folder. */
  files: Record<string, string>;
  /** The command line; `{dir}` stands for the case folder. */
  args: string[];
}

/** Numbers that must never reach an output. */
const NOT_A_NUMBER = /\bNaN\b|\bInfinity\b/;

/** What a run printed and wrote, for the checks. */
export interface CaseRun extends MainResult {
  args: string[];
  outputs: Record<string, string>;
}

/** Per case folder: the input files the last case left there unchanged (name → text). */
const leftInPlace = new Map<string, Map<string, string>>();

/**
 * Makes `dir` hold exactly `files`, as a fresh folder would. A folder used by an earlier case keeps
 * the inputs it still holds unchanged and loses everything else: on this machine's disk, removing
 * and writing a folder of six files costs about 3 ms, and a fuzz test runs some 5,600 cases.
 */
function prepareFolder(dir: string, files: Record<string, string>): void {
  const kept = leftInPlace.get(dir);
  leftInPlace.delete(dir);
  if (!kept) {
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(dir, { recursive: true });
  } else
    for (const name of readdirSync(dir))
      if (!Object.hasOwn(files, name) || kept.get(name) !== files[name]) rmSync(path.join(dir, name), { recursive: true, force: true });
  for (const [name, text] of Object.entries(files)) if (kept?.get(name) !== text) writeFileSync(path.join(dir, name), text);
}

/** Records the inputs a run left unchanged in `dir`, for the next case's prepareFolder. */
function noteInputs(dir: string, files: Record<string, string>): void {
  const kept = new Map<string, string>();
  for (const [name, text] of Object.entries(files)) {
    try {
      if (readFileSync(path.join(dir, name), 'utf8') === text) kept.set(name, text);
    } catch {
      // Gone or no longer a file: the next case writes it again.
    }
  }
  leftInPlace.set(dir, kept);
}

export async function runCase(c: FuzzCase, dir: string): Promise<CaseRun> {
  prepareFolder(dir, c.files);
  const args = c.args.map((a) => a.replaceAll('{dir}', dir));
  // A mutated command line may name any relative path: run from the case folder.
  const cwd = process.cwd();
  process.chdir(dir);
  let result: MainResult;
  try {
    result = await runMain(args);
  } finally {
    process.chdir(cwd);
  }
  noteInputs(dir, c.files);
  const outputs: Record<string, string> = {};
  const out = path.join(dir, 'out');
  if (existsSync(out) && statSync(out).isDirectory()) {
    for (const name of readdirSync(out)) outputs[name] = statSync(path.join(out, name)).isFile() ? readFileSync(path.join(out, name), 'utf8') : '(folder)';
  }
  return { ...result, args, outputs };
}

/** The faults of one run: an empty list when it passed. */
export function caseFaults(c: FuzzCase, run: CaseRun, dir: string): string[] {
  const faults: string[] = [];
  const inputText = Object.values(c.files).join('\n') + c.args.join(' ');
  if (run.status !== 0 && run.status !== 2) faults.push(`exit status ${run.status}`);
  if (/internal error/.test(run.stderr)) faults.push('internal error');
  if (run.status === 2) {
    const lines = run.stderr.trimEnd().split('\n');
    if (lines.length !== 1) faults.push(`${lines.length} lines on stderr`);
    if (!hasPlace(lines[0]!, c)) faults.push('a message with no place');
  }
  if (run.status === 0 && run.stderr !== '') faults.push('stderr on success');
  if (!NOT_A_NUMBER.test(inputText)) {
    if (NOT_A_NUMBER.test(run.stdout)) faults.push('NaN or Infinity on stdout');
    for (const [name, text] of Object.entries(run.outputs)) if (NOT_A_NUMBER.test(text)) faults.push(`NaN or Infinity in ${name}`);
  }
  for (const name of Object.keys(run.outputs)) if (name.startsWith('.crest-')) faults.push(`left over: ${name}`);
  for (const [name, text] of Object.entries(c.files)) {
    if (readFileSync(path.join(dir, name), 'utf8') !== text) faults.push(`input ${name} changed`);
  }
  return faults;
}

/**
 * A located message: `crest: command line: --flag ...` (the parser's own complaints too),
 * or `crest: <one of the case's files or a bundled file>: ...`.
 */
function hasPlace(line: string, c: FuzzCase): boolean {
  const m = /^crest: ([^:]+):/.exec(line);
  if (!m) return false;
  const place = m[1]!;
  if (place === 'command line') return /^crest: command line: \S/.test(line);
  // Messages are one line: a file name with a line break in it is shown with a space.
  const norm = (text: string) => path.basename(text.replace(/\s+/g, ' ').trim());
  const base = norm(place);
  return Object.keys(c.files).includes(base) || c.args.some((a) => norm(a) === base) || /sites\//.test(place);
}

/** A failing case with what it printed, for the test's message and the corpus. */
export function describeFailure(c: FuzzCase, run: CaseRun, faults: string[]): string {
  return JSON.stringify({ faults, args: c.args, stderr: run.stderr.slice(0, 400), files: c.files }, null, 1);
}

import { execFile, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { runMain } from '../support/run-main.js';

/** The built command line (`npm test` builds it first; run `npm run build` before `npx vitest run test/cli`). */
export const CLI = fileURLToPath(new URL('../../dist/cli.js', import.meta.url));

export interface CliResult {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** Runs `node dist/cli.js ...args` as a subprocess. */
export function runCli(args: string[], cwd?: string): CliResult {
  const result = spawnSync(process.execPath, [CLI, ...args], { encoding: 'utf8', cwd });
  return { status: result.status, stdout: result.stdout, stderr: result.stderr };
}

/** The same, without blocking: lets independent cases run side by side. */
export function runCliAsync(args: string[], cwd?: string): Promise<CliResult> {
  return new Promise((resolve) => {
    const child = execFile(process.execPath, [CLI, ...args], { encoding: 'utf8', cwd }, (_err, stdout, stderr) =>
      resolve({ status: child.exitCode, stdout, stderr }),
    );
  });
}

/** Writes the given files into a fresh temporary folder and returns its path. */
export function tempFiles(files: Record<string, string>): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'crest-cli-'));
  for (const [name, text] of Object.entries(files)) {
    mkdirSync(path.dirname(path.join(dir, name)), { recursive: true });
    writeFileSync(path.join(dir, name), text);
  }
  return dir;
}

let queue: Promise<unknown> = Promise.resolve();

/**
 * `crest ...args` in this process: main() of the build with its output captured (runMain), run
 * from `cwd` when given. Calls queue one behind the other (the output streams and the working
 * folder are the process's own), so concurrent tests may call it. No subprocess: use it unless a
 * test needs a fresh process (exit behaviour, worker threads, the package entry point).
 */
export function runCliInProcess(args: string[], cwd?: string): Promise<CliResult> {
  const run = async (): Promise<CliResult> => {
    const home = process.cwd();
    if (cwd) process.chdir(cwd);
    try {
      return await runMain(args);
    } finally {
      process.chdir(home);
    }
  };
  const result = queue.then(run, run);
  queue = result.catch(() => undefined);
  return result;
}

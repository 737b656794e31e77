import { execFile, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

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
  for (const [name, text] of Object.entries(files)) writeFileSync(path.join(dir, name), text);
  return dir;
}

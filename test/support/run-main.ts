// The command line in-process: main(argv) from the build with stdout and stderr captured, so a
// test can run thousands of cases without a subprocess each.
import { format } from 'node:util';
import { main } from '../../dist/cli/main.js';

export interface MainResult {
  status: number;
  stdout: string;
  stderr: string;
}

let running = false;

/** Runs `crest ...args` in this process. One at a time: the output streams are shared. */
export async function runMain(args: string[]): Promise<MainResult> {
  if (running) throw new Error('runMain: one call at a time');
  running = true;
  const out: string[] = [];
  const err: string[] = [];
  const writeOut = process.stdout.write;
  const writeErr = process.stderr.write;
  const capture = (sink: string[]) =>
    ((chunk: string | Uint8Array, ...rest: unknown[]) => {
      sink.push(typeof chunk === 'string' ? chunk : Buffer.from(chunk).toString('utf8'));
      const done = rest.find((r) => typeof r === 'function') as (() => void) | undefined;
      done?.();
      return true;
    }) as typeof process.stdout.write;
  // The test runner replaces console's methods with its own, so they are caught here too.
  const { log, error, warn } = console;
  process.stdout.write = capture(out);
  process.stderr.write = capture(err);
  console.log = (...a: unknown[]) => void out.push(`${format(...a)}\n`);
  console.error = console.warn = (...a: unknown[]) => void err.push(`${format(...a)}\n`);
  try {
    const status = await main(['node', 'crest', ...args]);
    return { status, stdout: out.join(''), stderr: err.join('') };
  } finally {
    process.stdout.write = writeOut;
    process.stderr.write = writeErr;
    Object.assign(console, { log, error, warn });
    running = false;
  }
}

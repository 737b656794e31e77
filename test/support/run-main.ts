// The command line in-process: main(argv) from the build with stdout and stderr captured, so a
// test can run thousands of cases without a subprocess each.
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
  const capture = (sink: string[]) => ((chunk: string | Uint8Array, ...rest: unknown[]) => {
    sink.push(typeof chunk === 'string' ? chunk : Buffer.from(chunk).toString('utf8'));
    const done = rest.find((r) => typeof r === 'function') as (() => void) | undefined;
    done?.();
    return true;
  }) as typeof process.stdout.write;
  process.stdout.write = capture(out);
  process.stderr.write = capture(err);
  try {
    const status = await main(['node', 'crest', ...args]);
    return { status, stdout: out.join(''), stderr: err.join('') };
  } finally {
    process.stdout.write = writeOut;
    process.stderr.write = writeErr;
    running = false;
  }
}

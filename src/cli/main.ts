import { CommanderError } from 'commander';
import { CrestError } from '../errors.js';
import { commandLineMessage } from './command-line-error.js';
import { buildProgram } from './program.js';

/**
 * Runs the command line and returns the exit status: 0 success, 2 bad input or an output that
 * cannot be written (one line on stderr, no stack trace), 1 internal fault (stack trace only
 * with --debug). It never calls process.exit, so a test can call it in-process with any argv
 * (argv[0] and argv[1] are node and the script, as in process.argv).
 */
export async function main(argv: string[]): Promise<number> {
  const debug = argv.includes('--debug');
  const program = buildProgram();
  try {
    await program.parseAsync(argv);
    return 0;
  } catch (err) {
    if (err instanceof CommanderError) {
      if (err.code === 'commander.helpDisplayed' || err.code === 'commander.version' || err.exitCode === 0) return 0;
      process.stderr.write(`crest: command line: ${commandLineMessage(err.message)}\n`);
      return 2;
    }
    if (err instanceof CrestError) {
      process.stderr.write(`crest: ${err.message}\n`);
      if (debug) process.stderr.write(`${err.stack}\n`);
      return 2;
    }
    const message = err instanceof Error ? err.message : String(err);
    process.stderr.write(`crest: internal error: ${message.split('\n')[0]}\n`);
    if (debug) process.stderr.write(`${(err as Error).stack}\n`);
    else process.stderr.write('crest: run again with --debug for the stack trace, and report it.\n');
    return 1;
  }
}

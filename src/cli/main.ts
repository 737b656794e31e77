import { CommanderError } from 'commander';
import { InputError } from '../errors.js';
import { buildProgram } from './program.js';

/**
 * Runs the command line and returns the exit status: 0 success, 2 bad input (one line on
 * stderr, no stack trace), 1 internal fault (stack trace only with --debug).
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
      return 2; // commander has already printed its one-line message
    }
    if (err instanceof InputError) {
      process.stderr.write(`crest: ${err.message}\n`);
      if (debug) process.stderr.write(`${err.stack}\n`);
      return 2;
    }
    process.stderr.write(`crest: internal error: ${(err as Error).message ?? String(err)}\n`);
    if (debug) process.stderr.write(`${(err as Error).stack}\n`);
    else process.stderr.write('crest: run again with --debug for the stack trace, and report it.\n');
    return 1;
  }
}

#!/usr/bin/env node
import { main } from './cli/main.js';

// A reader that stops early (`crest detect --json | head`) closes the pipe: stop quietly.
process.stdout.on('error', (err: NodeJS.ErrnoException) => {
  if (err.code !== 'EPIPE') throw err;
  process.exit(process.exitCode ?? 0);
});

process.exitCode = await main(process.argv);

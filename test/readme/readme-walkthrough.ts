// The README's walkthrough ("Plan your own campaign") as data: each fenced block that follows a
// `<!-- walkthrough: ... -->` comment, in README order. `file NAME` marks a file to write,
// `run` a console block to run, `install` the console block that installs the command.
import { readFileSync } from 'node:fs';

export type WalkthroughStep = { kind: 'file'; name: string; text: string } | { kind: 'run' | 'install'; commands: ShownCommand[] };

/** One `$ command` line of a console block and the output lines the README shows under it. */
export interface ShownCommand {
  command: string;
  shown: string[];
}

const MARKER = /^<!-- walkthrough: (file (\S+)|run|install) -->$/;
const FENCE = /^```/;

/** The steps of the walkthrough in `readmeFile`; a marker not followed by a fenced block is an error. */
export function readWalkthrough(readmeFile: string): WalkthroughStep[] {
  const lines = readFileSync(readmeFile, 'utf8').split(/\r?\n/);
  const steps: WalkthroughStep[] = [];
  lines.forEach((line, i) => {
    const marker = MARKER.exec(line);
    if (!marker) return;
    if (!FENCE.test(lines[i + 1] ?? '')) throw new Error(`${readmeFile}:${i + 1}: a walkthrough marker needs a fenced block on the next line`);
    const end = lines.findIndex((l, j) => j > i + 1 && FENCE.test(l));
    if (end < 0) throw new Error(`${readmeFile}:${i + 2}: the fenced block is not closed`);
    const body = lines.slice(i + 2, end);
    if (marker[2]) steps.push({ kind: 'file', name: marker[2], text: `${body.join('\n')}\n` });
    else steps.push({ kind: marker[1] as 'run' | 'install', commands: consoleCommands(body) });
  });
  return steps;
}

/** A console block's `$ ` lines, each with the lines under it up to the next `$ ` line. */
export function consoleCommands(body: string[]): ShownCommand[] {
  const commands: ShownCommand[] = [];
  for (const line of body) {
    if (line.startsWith('$ ')) commands.push({ command: line.slice(2), shown: [] });
    else if (commands.length === 0) throw new Error(`console block: output before any "$ " command: ${line}`);
    else commands[commands.length - 1]!.shown.push(line);
  }
  return commands;
}

// README "Plan your own campaign", run as written: its files go into an empty temporary folder,
// `npm link` installs the `crest` command into a temporary npm prefix, and every command of the
// walkthrough runs from that folder with that `crest` first on the PATH. Each must exit 0, print
// nothing on stderr, and print what the README shows under it.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { readWalkthrough, type ShownCommand } from './readme-walkthrough.js';
import { shownMismatch } from './shown-output.js';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const steps = readWalkthrough(path.join(ROOT, 'README.md'));
const commandsOf = (kind: 'run' | 'install'): ShownCommand[] => steps.flatMap((s) => (s.kind === kind ? s.commands : []));

/** A folder of npm's own layout (`bin/`, `lib/node_modules/`) standing in for the global one. */
const prefix = mkdtempSync(path.join(tmpdir(), 'crest-prefix-'));
/** The test's environment without the npm settings of the `npm test` or `npx vitest` that started it, and that prefix. */
const inherited = Object.fromEntries(Object.entries(process.env).filter(([name]) => !name.toLowerCase().startsWith('npm_config_')));
const env = { ...inherited, npm_config_prefix: prefix, PATH: `${path.join(prefix, 'bin')}${path.delimiter}${process.env.PATH}` };
const folder = mkdtempSync(path.join(tmpdir(), 'crest-walk-'));

afterAll(() => {
  // The two links npm made first (the checkout itself is behind one of them), then the folders.
  for (const link of [path.join(prefix, 'bin', 'crest'), path.join(prefix, 'lib', 'node_modules', 'crest')]) rmSync(link, { force: true });
  rmSync(prefix, { recursive: true, force: true });
  rmSync(folder, { recursive: true, force: true });
});

/** A README command line in bash (pipes as written; a failure anywhere in a pipe fails it). */
function runShell(command: string, cwd: string) {
  return spawnSync('bash', ['-o', 'pipefail', '-c', command], { cwd, env, encoding: 'utf8' });
}

/** npm's "added 1 package in 354ms" with the time left out. */
const withoutTime = (text: string) => text.replace(/ in [\d.]+m?s$/gm, ' in (time)');

function expectShown({ command, shown }: ShownCommand, stdout: string) {
  expect({ command, mismatch: shownMismatch(stdout, shown) }).toEqual({ command, mismatch: null });
}

describe('README walkthrough "Plan your own campaign"', () => {
  it('installs the crest command with npm link (the build already made: npm test builds first)', () => {
    // npm ci is the checkout's own setup, done before any test runs; the rest runs here.
    expect(commandsOf('install').map((c) => c.command)).toEqual(['npm ci', 'npm link', 'crest --version']);
    const [, link, version] = commandsOf('install');
    // Scripts off: the package's prepare script would rebuild dist/ while other test files read it.
    // Offline: a folder's link needs nothing from the registry.
    const linked = runShell(`${link!.command} --ignore-scripts --offline --no-audit --no-fund`, ROOT);
    expect(linked.status, linked.stderr).toBe(0);
    expect(withoutTime(linked.stdout)).toBe(withoutTime(`${link!.shown.join('\n')}\n`));
    expect(runShell('command -v crest', ROOT).stdout.trim()).toBe(path.join(prefix, 'bin', 'crest'));
    const printed = runShell(version!.command, tmpdir());
    expect(printed.status, printed.stderr).toBe(0);
    expectShown(version!, printed.stdout);
  });

  it('writes its files into an empty folder and runs its commands there, printing what the README shows', () => {
    const files = steps.flatMap((s) => (s.kind === 'file' ? [s] : []));
    for (const file of files) writeFileSync(path.join(folder, file.name), file.text);
    expect(readdirSync(folder).sort()).toEqual(['campaign.yaml', 'site.json', 'spectrograph.json', 'stars.csv']);
    const commands = commandsOf('run');
    expect(commands.map((c) => c.command.split(' ')[0])).toEqual(['crest', 'crest', 'crest', 'ls', 'head']);
    for (const shown of commands) {
      const result = runShell(shown.command, folder);
      expect({ command: shown.command, status: result.status, stderr: result.stderr }).toEqual({ command: shown.command, status: 0, stderr: '' });
      expectShown(shown, result.stdout);
    }
  });
});

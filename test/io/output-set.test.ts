// Output sets are whole: a writer killed at any step leaves, once the next run has tidied the
// folder, either the whole old set or the whole new one, and no temporary files. The writer
// runs in a child process (from dist/, `npm test` builds first) that kills itself with SIGKILL
// at the injected step, so nothing of the writer's own clean-up runs.
import { spawnSync } from 'node:child_process';
import { chmodSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { OutputError } from '../../src/errors.js';
import { checkOutFolder } from '../../src/io/out-folder.js';
import { recoverBeforeReading, recoverOutputSets, writeOutputSet } from '../../src/io/output-set.js';

const OUTPUT_SET = fileURLToPath(new URL('../../dist/io/output-set.js', import.meta.url));
const OLD = { 'plan.md': 'old md', 'plan.csv': 'old csv', 'plan.json': 'old json' };
const NEW = { 'plan.md': 'new md', 'plan.csv': 'new csv', 'plan.json': 'new json' };
const STEPS = ['staged plan.md', 'staged plan.csv', 'staged plan.json', 'committed', 'moved plan.md', 'moved plan.csv', 'moved plan.json', 'done'];

const fresh = () => mkdtempSync(path.join(tmpdir(), 'crest-set-'));
const contents = (dir: string) =>
  Object.fromEntries(
    readdirSync(dir)
      .sort()
      .map((name) => [name, readFileSync(path.join(dir, name), 'utf8')]),
  );

/** Writes NEW over OLD in a child process killed at the first step starting with `step`; returns how the child ended. */
function killedAt(dir: string, step: string): string | null {
  const script = `
    import { writeOutputSet } from ${JSON.stringify(OUTPUT_SET)};
    writeOutputSet(${JSON.stringify(dir)}, ${JSON.stringify(NEW)}, [], {
      afterStep: (s) => { if (s.startsWith(${JSON.stringify(step)})) process.kill(process.pid, 'SIGKILL'); },
    });`;
  return spawnSync(process.execPath, ['--input-type=module', '-e', script]).signal;
}

describe('output sets', () => {
  it.each(STEPS.map((step, i) => [step, i] as const))('killed after "%s": the next run finds the whole old or the whole new set', (step, i) => {
    const dir = fresh();
    writeOutputSet(dir, OLD, []);
    expect(killedAt(dir, step)).toBe('SIGKILL');
    recoverOutputSets(dir);
    const committed = i >= STEPS.indexOf('committed');
    expect(contents(dir)).toEqual(committed ? NEW : OLD);
  });

  it('lets a reader finish a committed set before it reads (crest report, crest map)', () => {
    const dir = fresh();
    writeOutputSet(dir, OLD, []);
    killedAt(dir, 'moved ');
    // One file moved, two still in the commit folder: a reader must not see this.
    const shown = Object.keys(NEW).map((name) => readFileSync(path.join(dir, name), 'utf8').startsWith('new'));
    expect(shown.filter(Boolean)).toHaveLength(1);
    recoverBeforeReading(path.join(dir, 'plan.json'));
    expect(contents(dir)).toEqual(NEW);
  });

  it('removes what a killed run left before writing the next set', () => {
    const dir = fresh();
    writeOutputSet(dir, OLD, []);
    killedAt(dir, 'staged plan.csv');
    expect(readdirSync(dir).some((name) => name.startsWith('.crest-staging-'))).toBe(true);
    writeOutputSet(dir, { ...NEW, 'report.html': 'new html' }, []);
    expect(contents(dir)).toEqual({ ...NEW, 'report.html': 'new html' });
  });

  it('keeps the old set when a file cannot be written (a full disk), with one line', () => {
    const dir = fresh();
    writeOutputSet(dir, OLD, []);
    const full = (step: string) => {
      if (step === 'staged plan.csv') throw Object.assign(new Error('no space left on device'), { code: 'ENOSPC' });
    };
    expect(() => writeOutputSet(dir, NEW, [], { afterStep: full })).toThrow(
      /^command line: --out = ".*": cannot write plan\.csv \(ENOSPC, the disk is full\); the files there are unchanged$/,
    );
    expect(contents(dir)).toEqual(OLD);
  });

  it('never replaces an input', () => {
    const dir = fresh();
    writeFileSync(path.join(dir, 'plan.json'), 'an input');
    expect(() => writeOutputSet(dir, NEW, [path.join(dir, 'plan.json')])).toThrow(OutputError);
    expect(contents(dir)).toEqual({ 'plan.json': 'an input' });
  });
});

describe('the out folder, checked before any computation', () => {
  const dir = fresh();
  writeFileSync(path.join(dir, 'a-file'), 'x');
  it.each([
    ['an existing file', path.join(dir, 'a-file'), /names an existing file; give a folder$/],
    ['a path under a file', path.join(dir, 'a-file', 'out'), /lies under .*a-file, which is a file, not a folder$/],
    ['a folder under /proc', '/proc/self', /a folder on a disk, not under \/proc, \/sys, \/dev$/],
    ['a device', '/dev/null', /a folder on a disk, not under \/proc, \/sys, \/dev$/],
  ])('refuses %s with one line', (_what, out, message) => {
    expect(() => checkOutFolder(out, ['plan.md'], [])).toThrow(OutputError);
    expect(() => checkOutFolder(out, ['plan.md'], [])).toThrow(message);
  });

  // Permission bits do not bind root, so this case needs an ordinary user.
  it.skipIf(process.getuid?.() === 0)('refuses a folder it cannot write in', () => {
    const locked = path.join(dir, 'locked');
    mkdirSync(locked);
    chmodSync(locked, 0o555);
    expect(() => checkOutFolder(locked, ['plan.md'], [])).toThrow(/a folder Crest can write in \(EACCES\)$/);
  });
});

describe('the out folder: a named output that is a folder', () => {
  it('is refused before any computation', () => {
    const dir = fresh();
    mkdirSync(path.join(dir, 'plan.md'));
    expect(() => checkOutFolder(dir, ['plan.md'], [])).toThrow(/a folder where plan\.md can be written \(.*plan\.md is not a file\)$/);
  });
});

// Line length (DEVELOPERS.md, "Conventions"): Biome wraps code at 160 columns but leaves long strings
// and comments alone, so this check reads every line of the project's TypeScript and .mjs sources.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const MAX_LINE_CHARS = 160;

/** The folders biome.json's `files.includes` names, walked whole; the root's own files are added below. */
const SOURCE_FOLDERS = ['src', 'test', 'reference', 'bench', 'examples'];
/** Folders that hold input data, not code (as excluded in biome.json). */
const SKIPPED = new Set(['fixtures', 'corpus', 'node_modules', 'dist', 'build']);
const isSource = (name: string) => name.endsWith('.ts') || name.endsWith('.mjs');

function sourcesIn(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    if (e.isDirectory()) return SKIPPED.has(e.name) ? [] : sourcesIn(path.join(dir, e.name));
    return isSource(e.name) ? [path.join(dir, e.name)] : [];
  });
}

/** `N (C characters)` for each line N longer than `maxChars`, counting code points. */
function longLines(text: string, maxChars: number): string[] {
  return text.split(/\r?\n/).flatMap((line, i) => {
    const chars = [...line].length;
    return chars > maxChars ? [`${i + 1} (${chars} characters)`] : [];
  });
}

const rootFiles = readdirSync(ROOT, { withFileTypes: true })
  .filter((e) => e.isFile() && isSource(e.name))
  .map((e) => path.join(ROOT, e.name));
const files = [...rootFiles, ...SOURCE_FOLDERS.flatMap((folder) => sourcesIn(path.join(ROOT, folder)))];
const rel = (file: string) => path.relative(ROOT, file).split(path.sep).join('/');

describe('line length', () => {
  it('reads the sources of every folder biome.json formats, and not the fixtures or the fuzz corpus', () => {
    const names = files.map(rel);
    for (const known of ['vitest.config.ts', 'src/cli.ts', 'test/style/line-length.test.ts', 'reference/schedule.ts', 'examples/under-way/make-observed.mjs']) {
      expect(names).toContain(known);
    }
    expect(names.filter((n) => n.includes('/fixtures/') || n.startsWith('test/fuzz/corpus/'))).toEqual([]);
  });

  it('finds a line one character over the limit, and only that one', () => {
    // A property the check must have: 160 characters pass, 161 fail; σ and ⊕ count as one character each.
    const text = ['a'.repeat(160), `${'σ'.repeat(160)}⊕`, '', `// ${'⊕'.repeat(157)}`].join('\n');
    expect(longLines(text, MAX_LINE_CHARS)).toEqual(['2 (161 characters)']);
  });

  it(`no line of a .ts or .mjs source is longer than ${MAX_LINE_CHARS} characters`, () => {
    const offenders = files.flatMap((file) => longLines(readFileSync(file, 'utf8'), MAX_LINE_CHARS).map((where) => `${rel(file)}:${where}`));
    expect(offenders, `wrap these lines (long strings as concatenations, long comments on several lines):\n${offenders.join('\n')}`).toEqual([]);
  });

  it("uses the same limit as Biome's formatter (biome.json formatter.lineWidth)", () => {
    const biome = JSON.parse(readFileSync(path.join(ROOT, 'biome.json'), 'utf8')) as { formatter: { lineWidth: number } };
    expect(biome.formatter.lineWidth).toBe(MAX_LINE_CHARS);
  });
});

// Past failures, kept as regression cases (test/fuzz/corpus/*.json). Each case starts from the
// fuzz test's valid inputs, changes what it names, and must pass the fuzz checks with an exit
// status of 2 and the expected one-line message. Add a file here for every failure the fuzz
// test finds, once it is fixed.
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { CAMPAIGN_YAML, INSTRUMENT_JSON, PLAN_JSON, RV_CSV, SITE_JSON, TARGETS_CSV } from './bases.js';
import { caseFaults, runCase, type FuzzCase } from './fuzz-case.js';

interface CorpusCase {
  name: string;
  /** Files replacing the valid ones, whole. */
  files: Record<string, string>;
  /** Keys merged into the valid site file or instrument profile. */
  site?: Record<string, unknown>;
  instrument?: Record<string, unknown>;
  /** Edits of a valid JSON file: the value at a key path replaced, or the key removed when no value is given. */
  jsonEdits?: Record<string, { path: (string | number)[]; value?: unknown }[]>;
  args: string[];
  /** The message, as a regular expression. */
  expect: string;
}

const CORPUS = path.join(path.dirname(new URL(import.meta.url).pathname), 'corpus');
const cases = readdirSync(CORPUS)
  .filter((name) => name.endsWith('.json'))
  .map((name) => JSON.parse(readFileSync(path.join(CORPUS, name), 'utf8')) as CorpusCase);

function edited(text: string, edits: { path: (string | number)[]; value?: unknown }[]): string {
  const data = JSON.parse(text);
  for (const edit of edits) {
    const parent = edit.path.slice(0, -1).reduce((node, key) => node[key], data);
    const key = edit.path[edit.path.length - 1]!;
    if ('value' in edit) parent[key] = edit.value;
    else delete parent[key];
  }
  return JSON.stringify(data, null, 2);
}

function fuzzCase(c: CorpusCase): FuzzCase {
  const files: Record<string, string> = {
    'campaign.yaml': CAMPAIGN_YAML,
    'targets.csv': TARGETS_CSV,
    'site.json': JSON.stringify({ ...JSON.parse(SITE_JSON), ...c.site }),
    'instrument.json': JSON.stringify({ ...JSON.parse(INSTRUMENT_JSON), ...c.instrument }),
    'rv.csv': RV_CSV,
    'plan.json': PLAN_JSON,
    ...c.files,
  };
  for (const [name, edits] of Object.entries(c.jsonEdits ?? {})) files[name] = edited(files[name]!, edits);
  return { files, args: c.args };
}

describe('fuzz corpus: past failures stay fixed', () => {
  const root = mkdtempSync(path.join(tmpdir(), 'crest-corpus-'));
  afterAll(() => rmSync(root, { recursive: true, force: true }));
  it.each(cases.map((c) => [c.name, c] as const))('%s', async (name, c) => {
    const fc = fuzzCase(c);
    const dir = path.join(root, name);
    const run = await runCase(fc, dir);
    expect(caseFaults(fc, run, dir)).toEqual([]);
    expect(run.status).toBe(2);
    expect(run.stderr.trimEnd()).toMatch(new RegExp(c.expect));
  });
});

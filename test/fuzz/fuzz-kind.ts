// Seeded fuzzing of every input Crest reads, run in-process through the CLI's entry point, one
// test file per input kind (test/fuzz/fuzz-*.test.ts, so that the two test workers share the
// load). No case may end in an internal error, a message over one line or without a place, NaN
// or Infinity in an output, a changed input or a left-over temporary file (test/fuzz/fuzz-case.ts).
// Most cases stop before planning (an --out naming an existing file is refused after the inputs
// are read); every FULL_EVERY-th case of a kind runs to the end.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createRng, type Rng } from '../../src/rv/random.js';
import { CAMPAIGN_YAML, INSTRUMENT_JSON, SITE_JSON, TARGETS_CSV } from './bases.js';
import { caseFaults, describeFailure, runCase, type FuzzCase } from './fuzz-case.js';
import { mutateJson, mutateText } from './mutate.js';

export const FULL_EVERY = 100;
export const BASE_FILES = { 'campaign.yaml': CAMPAIGN_YAML, 'targets.csv': TARGETS_CSV, 'site.json': SITE_JSON, 'instrument.json': INSTRUMENT_JSON };
export const NIGHT = ['--from', '2027-03-01', '--to', '2027-03-01'];

/** One to three edits; JSON files get structural edits half of the time. */
export function mutated(text: string, rng: Rng, json: boolean): string {
  let out = text;
  const edits = 1 + Math.floor(rng.uniform() * 3);
  for (let k = 0; k < edits; k++) {
    try {
      out = json && rng.uniform() < 0.5 ? mutateJson(out, rng) : mutateText(out, rng);
    } catch {
      out = mutateText(out, rng); // an earlier edit broke the JSON
    }
  }
  return out;
}

export const choose = <T>(rng: Rng, list: T[]): T => list[Math.floor(rng.uniform() * list.length)]!;

export interface Kind {
  name: string;
  cases: number;
  make(rng: Rng, index: number): FuzzCase;
}

/** The test of one input kind: `kind.cases` cases drawn from the seed, stopping at the third failure. */
export function fuzzKind(kind: Kind, seed: number): void {
  describe('fuzz: mutated inputs never end in an internal error, NaN, a bare or multi-line message, or a changed input', () => {
    const root = mkdtempSync(path.join(tmpdir(), 'crest-fuzz-'));
    afterAll(() => rmSync(root, { recursive: true, force: true }));
    it(`${kind.name}: ${kind.cases} seeded cases`, async () => {
      const rng = createRng(seed);
      const dir = path.join(root, 'case');
      const failures: string[] = [];
      for (let i = 0; i < kind.cases && failures.length < 3; i++) {
        const c = kind.make(rng, i);
        const run = await runCase(c, dir);
        const faults = caseFaults(c, run, dir);
        if (faults.length) failures.push(describeFailure(c, run, faults));
      }
      expect(failures).toEqual([]);
    });
  });
}

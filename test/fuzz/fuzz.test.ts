// Seeded fuzzing of every input Crest reads, run in-process through the CLI's entry point.
// No case may end in an internal error, a message over one line or without a place, NaN or
// Infinity in an output, a changed input or a left-over temporary file (test/fuzz/fuzz-case.ts).
// Most cases stop before planning (an --out naming an existing file is refused after the inputs
// are read); every FULL_EVERY-th case of a kind runs to the end.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { createRng, type Rng } from '../../src/rv/random.js';
import { CAMPAIGN_YAML, INSTRUMENT_JSON, PLAN_JSON, RV_CSV, SITE_JSON, TARGETS_CSV } from './bases.js';
import { caseFaults, describeFailure, runCase, type FuzzCase } from './fuzz-case.js';
import { mutateArgs, mutateJson, mutateText } from './mutate.js';

const FULL_EVERY = 100;
const BASE_FILES = { 'campaign.yaml': CAMPAIGN_YAML, 'targets.csv': TARGETS_CSV, 'site.json': SITE_JSON, 'instrument.json': INSTRUMENT_JSON };
const NIGHT = ['--from', '2027-03-01', '--to', '2027-03-01'];

/** One to three edits; JSON files get structural edits half of the time. */
function mutated(text: string, rng: Rng, json: boolean): string {
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

const choose = <T>(rng: Rng, list: T[]): T => list[Math.floor(rng.uniform() * list.length)]!;

interface Kind {
  name: string;
  cases: number;
  make(rng: Rng, index: number): FuzzCase;
}

const KINDS: Kind[] = [
  {
    name: 'target list',
    cases: 1200,
    make: (rng) => ({
      files: { ...BASE_FILES, 'targets.csv': mutated(TARGETS_CSV, rng, false) },
      args: choose(rng, [
        ['detect', '--targets', '{dir}/targets.csv', '--instrument', '{dir}/instrument.json'],
        ['detect', '--targets', '{dir}/targets.csv', '--instrument', 'stable-2m', '--visits', '12', '--json'],
        ['detect', '--targets', '{dir}/targets.csv', '--instrument', 'stable-2m', '--csv'],
        ['detect', '--targets', '{dir}/targets.csv', '--instrument', 'stable-2m'],
        ['visibility', '--site', '{dir}/site.json', '--targets', '{dir}/targets.csv', ...NIGHT],
      ]),
    }),
  },
  {
    name: 'campaign',
    cases: 800,
    make: (rng, i) => ({
      files: { ...BASE_FILES, 'campaign.yaml': mutated(CAMPAIGN_YAML, rng, false) },
      args: ['plan', '{dir}/campaign.yaml', '--out', i % FULL_EVERY === 0 ? '{dir}/out' : '{dir}/campaign.yaml'],
    }),
  },
  {
    name: 'site',
    cases: 600,
    make: (rng, i) => ({
      files: { ...BASE_FILES, 'site.json': mutated(SITE_JSON, rng, true) },
      args:
        i % FULL_EVERY === 0
          ? ['plan', '{dir}/campaign.yaml', '--out', '{dir}/out']
          : choose(rng, [
              ['nights', '--site', '{dir}/site.json', '--from', '2027-03-01', '--to', '2027-03-02'],
              ['visibility', '--site', '{dir}/site.json', '--targets', '{dir}/targets.csv', ...NIGHT, '--json'],
              ['plan', '{dir}/campaign.yaml', '--out', '{dir}/site.json'],
            ]),
    }),
  },
  {
    name: 'instrument',
    cases: 600,
    make: (rng) => ({
      files: { ...BASE_FILES, 'instrument.json': mutated(INSTRUMENT_JSON, rng, true) },
      args: choose(rng, [
        ['precision', '--instrument', '{dir}/instrument.json', '--vmag', '9', '--teff', '5200'],
        ['precision', '--instrument', '{dir}/instrument.json', '--vmag', '12', '--teff', '3400', '--target-sigma', '2', '--json'],
        ['precision', '--instrument', '{dir}/instrument.json', '--vmag', '6', '--teff', '6100', '--exposure', '300'],
        ['detect', '--targets', '{dir}/targets.csv', '--instrument', '{dir}/instrument.json'],
      ]),
    }),
  },
  {
    name: 'RV series',
    cases: 600,
    make: (rng) => ({
      files: { 'rv.csv': mutated(RV_CSV, rng, false) },
      args: choose(rng, [['periodogram', '{dir}/rv.csv'], ['periodogram', '{dir}/rv.csv', '--json', '--top', '3']]),
    }),
  },
  {
    name: 'plan.json',
    cases: 800,
    make: (rng, i) => {
      const out = i % FULL_EVERY === 0 ? '{dir}/out' : '{dir}/plan.json';
      return {
        files: { 'plan.json': mutated(PLAN_JSON, rng, true) },
        args: choose(rng, [
          ['report', '{dir}/plan.json', '--out', out],
          ['map', '--plan', '{dir}/plan.json', '--target', 'Teyu-3', '--grid', '2x2', '--trials', '10', '--out', out],
          ['map', '--plan', '{dir}/plan.json', '--grid', '2x3', '--trials', '10', '--out', '{dir}/plan.json'],
        ]),
      };
    },
  },
  {
    name: 'command-line flags',
    cases: 1000,
    make: (rng) => {
      const template = choose(rng, [
        ['amplitude', '--star-mass', '0.9', '--period', '4.2', '--planet-mass', '12', '--ecc', '0.1'],
        ['amplitude', '--star-mass', '1.1', '--period', '300', '--k', '2.5', '--incl', '60', '--json'],
        ['precision', '--instrument', 'stable-4m', '--vmag', '9.5', '--teff', '5100', '--airmass', '1.3', '--exposure', '900'],
        ['detect', '--vmag', '10', '--teff', '4800', '--instrument', 'compact-1m', '--planet-mass', '20', '--period', '12', '--visits', '30'],
        ['nights', '--site', 'la-silla', '--from', '2027-03-01', '--to', '2027-03-02', '--twilight', 'astronomical'],
        ['visibility', '--site', 'la-silla', '--targets', '{dir}/targets.csv', ...NIGHT, '--max-airmass', '1.8', '--moon-sep', '20'],
        ['periodogram', '{dir}/rv.csv', '--min-period', '2', '--max-period', '30', '--oversample', '5'],
        ['plan', '{dir}/campaign.yaml', '--seed', '4', '--out', '{dir}/campaign.yaml'],
        ['map', '--plan', '{dir}/plan.json', '--periods', '2:40', '--masses', '1:50', '--grid', '3x3', '--trials', '20', '--fap', '0.01', '--out', '{dir}/plan.json'],
        ['report', '{dir}/plan.json', '--out', '{dir}/plan.json'],
      ]);
      let args = mutateArgs(template, rng);
      if (rng.uniform() < 0.3) args = mutateArgs(args, rng);
      return { files: { ...BASE_FILES, 'rv.csv': RV_CSV, 'plan.json': PLAN_JSON }, args };
    },
  },
];

describe('fuzz: mutated inputs never end in an internal error, NaN, a bare or multi-line message, or a changed input', () => {
  const root = mkdtempSync(path.join(tmpdir(), 'crest-fuzz-'));
  afterAll(() => rmSync(root, { recursive: true, force: true }));
  KINDS.forEach((kind, k) => {
    it(`${kind.name}: ${kind.cases} seeded cases`, async () => {
      const rng = createRng(1700 + k);
      const dir = path.join(root, String(k));
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
});

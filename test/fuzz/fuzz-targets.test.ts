// Fuzz (test/fuzz/fuzz-kind.ts): mutated target lists.
import { TARGETS_CSV } from './bases.js';
import { BASE_FILES, NIGHT, choose, fuzzKind, mutated } from './fuzz-kind.js';

fuzzKind(
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
  1700,
);

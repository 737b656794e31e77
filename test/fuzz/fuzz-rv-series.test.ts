// Fuzz (test/fuzz/fuzz-kind.ts): mutated RV series.
import { RV_CSV } from './bases.js';
import { choose, fuzzKind, mutated } from './fuzz-kind.js';

fuzzKind(
  {
    name: 'RV series',
    cases: 600,
    make: (rng) => ({
      files: { 'rv.csv': mutated(RV_CSV, rng, false) },
      args: choose(rng, [
        ['periodogram', '{dir}/rv.csv'],
        ['periodogram', '{dir}/rv.csv', '--json', '--top', '3'],
      ]),
    }),
  },
  1704,
);

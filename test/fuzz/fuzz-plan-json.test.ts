// Fuzz (test/fuzz/fuzz-kind.ts): mutated plan.json files.
import { PLAN_JSON } from './bases.js';
import { FULL_EVERY, choose, fuzzKind, mutated } from './fuzz-kind.js';

fuzzKind(
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
  1705,
);

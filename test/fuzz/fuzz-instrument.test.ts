// Fuzz (test/fuzz/fuzz-kind.ts): mutated instrument profiles.
import { INSTRUMENT_JSON } from './bases.js';
import { BASE_FILES, choose, fuzzKind, mutated } from './fuzz-kind.js';

fuzzKind(
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
  1703,
);

// Fuzz (test/fuzz/fuzz-kind.ts): mutated site files.
import { SITE_JSON } from './bases.js';
import { BASE_FILES, FULL_EVERY, NIGHT, choose, fuzzKind, mutated } from './fuzz-kind.js';

fuzzKind(
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
  1702,
);

// Fuzz (test/fuzz/fuzz-kind.ts): mutated campaign files.
import { CAMPAIGN_YAML } from './bases.js';
import { BASE_FILES, FULL_EVERY, fuzzKind, mutated } from './fuzz-kind.js';

fuzzKind(
  {
    name: 'campaign',
    cases: 800,
    make: (rng, i) => ({
      files: { ...BASE_FILES, 'campaign.yaml': mutated(CAMPAIGN_YAML, rng, false) },
      args: ['plan', '{dir}/campaign.yaml', '--out', i % FULL_EVERY === 0 ? '{dir}/out' : '{dir}/campaign.yaml'],
    }),
  },
  1701,
);

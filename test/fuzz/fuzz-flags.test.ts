// Fuzz (test/fuzz/fuzz-kind.ts): mutated command lines.
import { PLAN_JSON, RV_CSV } from './bases.js';
import { BASE_FILES, NIGHT, choose, fuzzKind } from './fuzz-kind.js';
import { mutateArgs } from './mutate.js';

fuzzKind(
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
        [
          'map',
          '--plan',
          '{dir}/plan.json',
          '--periods',
          '2:40',
          '--masses',
          '1:50',
          '--grid',
          '3x3',
          '--trials',
          '20',
          '--fap',
          '0.01',
          '--out',
          '{dir}/plan.json',
        ],
        ['report', '{dir}/plan.json', '--out', '{dir}/plan.json'],
        ['plan', '{dir}/campaign.yaml', '--sweep-nights', '2:3', '--out', '{dir}/campaign.yaml'],
        ['map', '--plan', '{dir}/plan.json', '--grid', '3x3', '--trials', '20', '--shard', '0/2', '--out', '{dir}/plan.json'],
        ['map', '--plan', '{dir}/plan.json', '--grid', '3x3', '--trials', '20', '--merge'],
      ]);
      let args = mutateArgs(template, rng);
      if (rng.uniform() < 0.3) args = mutateArgs(args, rng);
      return { files: { ...BASE_FILES, 'rv.csv': RV_CSV, 'plan.json': PLAN_JSON }, args };
    },
  },
  1706,
);

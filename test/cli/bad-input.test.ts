import { describe, it } from 'vitest';
import { runCliInProcess, tempFiles } from './run-cli.js';

const CAMPAIGN = (overrides: Record<string, string> = {}) => {
  const fields: Record<string, string> = {
    name: 'Test',
    site: 'la-silla',
    instrument: 'stable-2m',
    targets: 'targets.csv',
    window: '{ start: 2027-03-01, end: 2027-03-31 }',
    time: '{ mode: choose-nights, nights: 3 }',
    ...overrides,
  };
  return Object.entries(fields)
    .map(([k, v]) => `${k}: ${v}`)
    .join('\n');
};
const HEADER = 'id,ra,dec,vmag,teffK,periodDays,tcBjdTdb,planetMsiniEarth,ecc';
const GOOD_ROW = 'Alba,10:00:00,-30:00:00,9.5,5200,4.1,2461000.5,10,';
const targets = (...rows: string[]) => `${HEADER}\n${GOOD_ROW}\n${rows.join('\n')}\n`;

/** A campaign in a temporary folder, run with `crest plan campaign.yaml` from that folder. */
function planCase(files: Record<string, string>): string[] {
  const dir = tempFiles({ 'campaign.yaml': CAMPAIGN(), 'targets.csv': targets(), ...files });
  return ['--cwd', dir];
}

const AMP = ['amplitude', '--star-mass', '1', '--period', '10'];

// Each case: the command line (or a campaign folder), and the place the one-line message must name.
const CASES: [string, string[], RegExp][] = [
  [
    'bad CSV row (too many cells)',
    planCase({ 'targets.csv': targets('Bruma,11:00:00,-20:00:00,9,5000,3,2461000.1,5,,extra') }),
    /^crest: targets\.csv: line 3: malformed CSV/,
  ],
  [
    'bad CSV value',
    planCase({ 'targets.csv': targets('Bruma,11:00:00,-20:00:00,bright,5000,,,,') }),
    /^crest: targets\.csv: row 2 \(line 3\): vmag = "bright"/,
  ],
  ['RA 25h', planCase({ 'targets.csv': targets('Bruma,25:00:00,-20:00:00,9,5000,,,,') }), /^crest: targets\.csv: row 2 \(line 3\): ra = "25:00:00"/],
  ['Dec +95 deg', planCase({ 'targets.csv': targets('Bruma,11:00:00,+95:00:00,9,5000,,,,') }), /^crest: targets\.csv: row 2 \(line 3\): dec = "\+95:00:00"/],
  [
    'negative period in the target list',
    planCase({ 'targets.csv': targets('Bruma,11:00:00,-20:00:00,9,5000,-3,2461000.1,5,') }),
    /^crest: targets\.csv: row 2 \(line 3\): periodDays = "-3"/,
  ],
  [
    'a star too hot for the RV-information table',
    planCase({ 'targets.csv': targets('Bruma,11:00:00,-20:00:00,9,9500,3,2461000.1,5,') }),
    /^crest: targets\.csv: row 2 \(line 3\): teffK = 9500: outside 3000-8000 K, .*\(instrument stable-2m\)$/,
  ],
  [
    'observed file: an RV without its error',
    planCase({
      'campaign.yaml': `${CAMPAIGN()}\nobserved: observed.csv`,
      'observed.csv': 'target,midBjdTdb,instrument,rvMps,rvErrorMps\nAlba,2461480.6,spec,3.1,\n',
    }),
    /^crest: observed\.csv: row 1 \(line 2\): rvErrorMps/,
  ],
  [
    'observed file: an unknown star',
    planCase({ 'campaign.yaml': `${CAMPAIGN()}\nobserved: observed.csv`, 'observed.csv': 'target,midUtc,instrument\nNessa,2027-03-02T03:00:00Z,spec\n' }),
    /^crest: observed\.csv: row 1 \(line 2\): target = "Nessa"/,
  ],
  ['--now without a zone', ['plan', '--now', '2027-03-15T02:00'], /^crest: command line: --now = "2027-03-15T02:00"/],
  ['--lost with a bad date', ['plan', '--lost', '2027-02-30'], /^crest: command line: --lost = "2027-02-30"/],
  ['next without --at', ['next'], /^crest: command line: --at: required option not specified$/],
  ['an unknown option, with the nearest', ['amplitude', '--star-mas', '1'], /^crest: command line: --star-mas: unknown option \(did you mean --star-mass\?\)$/],
  ['an unknown command', ['plot'], /^crest: command line: plot: unknown command \(did you mean plan\?\)$/],
  ['a flag without its value', ['plan', '--seed'], /^crest: command line: --seed: option argument missing$/],
  ['too many arguments', ['plan', 'a.yaml', 'b.yaml'], /^crest: command line: plan: too many arguments \(at most 1, got 2\)$/],
  ['negative period flag', [...AMP.slice(0, 3), '--period', '-3', '--k', '2'], /^crest: command line: --period = "-3"/],
  [
    'e >= 1 in the target list',
    planCase({ 'targets.csv': targets('Bruma,11:00:00,-20:00:00,9,5000,3,2461000.1,5,1.2') }),
    /^crest: targets\.csv: row 2 \(line 3\): ecc = "1\.2"/,
  ],
  ['e >= 1 flag', [...AMP, '--k', '2', '--ecc', '1'], /^crest: command line: --ecc = "1"/],
  ['unknown site id', planCase({ 'campaign.yaml': CAMPAIGN({ site: 'nowhere-peak' }) }), /^crest: campaign\.yaml: site = "nowhere-peak": unknown site id/],
  [
    'unknown instrument id',
    planCase({ 'campaign.yaml': CAMPAIGN({ instrument: 'hyper-9m' }) }),
    /^crest: campaign\.yaml: instrument = "hyper-9m": unknown instrument id/,
  ],
  ['unknown mass unit', [...AMP, '--planet-mass', '3', '--mass-unit', 'moon'], /^crest: command line: --mass-unit = "moon": one of earth, jupiter/],
  ['both --planet-mass and --k', [...AMP, '--planet-mass', '3', '--k', '2'], /^crest: command line: --k = 2: give --planet-mass or --k, not both/],
  ['neither --planet-mass nor --k', AMP, /^crest: command line: --planet-mass = \(missing\)/],
  ['malformed YAML', planCase({ 'campaign.yaml': 'name: [Test\nsite: la-silla\n' }), /^crest: campaign\.yaml: line \d+, column \d+: malformed YAML/],
  [
    'missing required column',
    planCase({ 'targets.csv': 'id,ra,vmag,teffK\nAlba,10:00:00,9.5,5200\n' }),
    /^crest: targets\.csv: header: dec = \(missing\): required column missing/,
  ],
  ['empty target list', planCase({ 'targets.csv': '' }), /^crest: targets\.csv: \(file\) = \(empty\)/],
  ['empty campaign file', planCase({ 'campaign.yaml': '  \n' }), /^crest: campaign\.yaml: \(file\) = \(empty\)/],
  [
    'window end before start',
    planCase({ 'campaign.yaml': CAMPAIGN({ window: '{ start: 2027-03-10, end: 2027-03-01 }' }) }),
    /^crest: campaign\.yaml: window\.end = "2027-03-01"/,
  ],
  ['missing campaign file', ['plan', 'no-such-campaign.yaml'], /^crest: no-such-campaign\.yaml: campaign file no such file/],
  // The demo campaign is read, then the out folder is refused before any planning.
  ['--out under /proc', ['plan', '--out', '/proc/self/crest'], /^crest: command line: --out = "\/proc\/self\/crest": a folder on a disk, not under \/proc/],
  ['--out naming a file', ['plan', '--out', 'package.json'], /^crest: command line: --out = "package\.json": names an existing file; give a folder$/],
  [
    '--out under a file',
    ['plan', '--out', 'package.json/out'],
    /^crest: command line: --out = "package\.json\/out": lies under .*package\.json, which is a file/,
  ],
];

describe('bad input: exit 2 and one line naming the place', () => {
  it.concurrent.for(CASES)('%s', async ([, args, place], { expect }) => {
    const r = args[0] === '--cwd' ? await runCliInProcess(['plan', 'campaign.yaml'], args[1]) : await runCliInProcess(args);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    const lines = r.stderr.trimEnd().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(place);
    expect(r.stderr).not.toMatch(/^\s+at /m); // no stack trace
  });
});

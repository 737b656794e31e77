import type { Command } from 'commander';
import { inputError } from '../errors.js';
import { instrumentFromFlag } from '../io/site-list.js';
import { readTargets } from '../io/targets.js';
import { toCsv } from '../report/csv.js';
import { MASS_DECIMALS, MASS_SYMBOL, MASS_UNITS, type MassUnit, massInEarth, massInUnit } from '../report/mass-unit.js';
import { fmt, renderTable, type Column } from '../report/table.js';
import { periodGridDays } from '../rv/detect.js';
import { targetDetectability, type DetectOptions, type DetectStar, type TargetDetectability } from '../rv/target-detect.js';
import { addExposureFlags, addStarFlags, checkExposureFlags, starFromFlags, type StarFlags } from './precision.js';
import { choiceFlag, numberFlag, printJson } from './options.js';

/** The heaviest hypothetical planet (M⊕): past about 94 MJup a companion is a star. */
const MAX_PLANET_MASS_EARTH = 3e4;

/** Period grid of the mass-limit table (days). */
const LIMIT_PERIODS_DAYS = periodGridDays(1, 1000);

interface DetectFlags extends StarFlags {
  targets?: string;
  name: string;
  instrument: string;
  significance: number;
  visits?: number;
  planetMass?: number;
  massUnit: MassUnit;
  period?: number;
  ecc?: number;
  exposure?: number;
  targetSigma?: number;
  airmass: number;
  seeing?: number;
  json?: boolean;
  csv?: boolean;
}

function stars(opts: DetectFlags): DetectStar[] {
  const starGiven = opts.vmag !== undefined || opts.teff !== undefined;
  if (opts.targets !== undefined && starGiven) {
    throw inputError({ file: 'command line', field: '--targets', value: opts.targets, allowed: 'give --targets FILE or one star (--vmag, --teff), not both' });
  }
  if (opts.targets !== undefined) return readTargets(opts.targets);
  if (!starGiven)
    throw inputError({ file: 'command line', field: '--targets', value: undefined, allowed: 'a target list (CSV), or one star with --vmag and --teff' });
  return [starFromFlags(opts, opts.name)];
}

function detectOptions(opts: DetectFlags): DetectOptions {
  if ((opts.planetMass === undefined) !== (opts.period === undefined)) {
    const missing = opts.planetMass === undefined ? '--planet-mass' : '--period';
    throw inputError({ file: 'command line', field: missing, value: undefined, allowed: '--planet-mass and --period go together' });
  }
  if (opts.ecc !== undefined && opts.planetMass === undefined) {
    throw inputError({ file: 'command line', field: '--ecc', value: String(opts.ecc), allowed: 'only with --planet-mass and --period' });
  }
  checkExposureFlags(opts);
  const planetMassEarth = opts.planetMass === undefined ? undefined : massInEarth(opts.planetMass, opts.massUnit);
  if (planetMassEarth !== undefined && planetMassEarth > MAX_PLANET_MASS_EARTH) {
    const allowed = `at most ${MAX_PLANET_MASS_EARTH} M⊕ (${fmt(massInUnit(MAX_PLANET_MASS_EARTH, 'jupiter'), 1)} MJup)`;
    throw inputError({ file: 'command line', field: '--planet-mass', value: String(opts.planetMass), allowed });
  }
  return {
    goalSignificance: opts.significance,
    airmass: opts.airmass,
    exposureSec: opts.exposure,
    targetVisitSigmaMps: opts.targetSigma,
    seeingArcsec: opts.seeing,
    visits: opts.visits,
    hypothetical: planetMassEarth === undefined ? undefined : { msiniEarth: planetMassEarth, periodDays: opts.period!, ecc: opts.ecc },
    periodsDays: opts.visits === undefined ? undefined : LIMIT_PERIODS_DAYS,
  };
}

const pair = (a: number | undefined, b: number | undefined, decimals: number) => (a === undefined ? '-' : `${fmt(a, decimals)}/${fmt(b, decimals)}`);

function printTable(rows: TargetDetectability[], options: DetectOptions, unit: MassUnit): void {
  const n = options.goalSignificance;
  const mass = (earth: number | undefined) => (earth === undefined ? undefined : massInUnit(earth, unit));
  const massDecimals = MASS_DECIMALS[unit];
  const levels = [...new Set([3, 5, n])].sort((a, b) => a - b);
  const columns: Column[] = [
    { header: 'target' },
    { header: 'V', align: 'right' },
    { header: 'Teff', align: 'right' },
    { header: 'K (m/s)', align: 'right' },
    { header: 'sigma (m/s)', align: 'right' },
    { header: 'exp (s)', align: 'right' },
    ...levels.map((level) => ({ header: `N ${level}sig`, align: 'right' as const })),
    { header: `hours ${n}sig`, align: 'right' },
  ];
  const at = options.visits;
  if (at !== undefined) {
    columns.push(
      { header: `P(${n}sig|N=${at})`, align: 'right' },
      { header: `min m sin i (${MASS_SYMBOL[unit]})`, align: 'right' },
      { header: `m sin i 50%/90% (${MASS_SYMBOL[unit]})`, align: 'right' },
    );
  }
  columns.push({ header: 'verdict' });
  const body = rows.map((r) => {
    const need = (level: number) => r.needed.find((v) => v.goalSignificance === level);
    const goal = need(n);
    const cells = [
      r.targetId,
      fmt(r.vmag, 1),
      fmt(r.teffK, 0),
      fmt(r.planet?.kMps, 2),
      fmt(r.effectiveSigmaMps, 2),
      `${r.exposure.exposureSec}${r.exposure.tooFaint ? '!' : ''}`,
      ...levels.map((level) => pair(need(level)?.random, need(level)?.quadrature, 0)),
      pair(goal?.hoursRandom, goal?.hoursQuadrature, 1),
    ];
    if (at !== undefined) {
      const p = r.atPlannedVisits!;
      cells.push(
        pair(p.probabilityRandom, p.probabilityQuadrature, 2),
        pair(mass(p.massMinRandomEarth), mass(p.massMinQuadratureEarth), massDecimals),
        pair(mass(p.mass50RandomEarth), mass(p.mass90RandomEarth), massDecimals),
      );
    }
    cells.push(r.verdict.level);
    return cells;
  });
  console.log(renderTable(columns, body));
  console.log(
    '\nPairs a/b: at random orbital phases / at ideal quadratures. sigma per visit includes floor and jitter; the floor does not average down. ' +
      '"!": exposure at the maximum; "-": never.',
  );
  if (at !== undefined) console.log(`m sin i 50%/90%: the m sin i detected (K/sigma_K > ${n}) in half / nine in ten of such campaigns at random phases.`);
}

function printNotes(rows: TargetDetectability[]): void {
  console.log('\nVerdicts:');
  for (const r of rows) {
    const planet = r.planet ? ` [${r.planet.note}]` : '';
    const est = r.estimated.length ? ` (estimated: ${r.estimated.join(', ')})` : '';
    console.log(`  ${r.targetId}: ${r.verdict.level}: ${r.verdict.text}${planet}${est}`);
    const b = r.exposure.budget;
    console.log(`    S/N per pixel ${fmt(b.snrPerPixel, 1)} at ${b.snrWavelengthNm} nm; jitter ${fmt(b.jitterMps, 2)} m/s (${r.jitterSource ?? 'as given'})`);
    if (b.teffWarning) console.log(`    warning: ${b.teffWarning}`);
  }
}

function printLimits(rows: TargetDetectability[], options: DetectOptions, unit: MassUnit): void {
  const first = rows[0]?.atPlannedVisits?.massLimits;
  if (!first) return;
  const what = `Smallest detectable m sin i (${MASS_SYMBOL[unit]}) for K/sigma_K = ${options.goalSignificance}`;
  console.log(`\n${what} with ${options.visits} visits at random phases:`);
  const limit = (r: TargetDetectability, i: number) => fmt(massInUnit(r.atPlannedVisits!.massLimits![i]!.massMinRandomEarth, unit), MASS_DECIMALS[unit]);
  const body = first.map((l, i) => [fmt(l.periodDays, 0), ...rows.map((r) => limit(r, i))]);
  console.log(renderTable([{ header: 'P (d)', align: 'right' }, ...rows.map((r) => ({ header: r.targetId, align: 'right' as const }))], body));
}

function csvRows(rows: TargetDetectability[], options: DetectOptions): string {
  const levels = [...new Set([3, 5, options.goalSignificance])].sort((a, b) => a - b);
  const header = [
    'target',
    'vmag',
    'teffK',
    'massSun',
    'planetSource',
    'planetMsiniEarth',
    'periodDays',
    'ecc',
    'kMps',
    'exposureSec',
    'tooFaint',
    'photonSigmaMps',
    'visitSigmaMps',
    'effectiveSigmaMps',
    'visitCostSec',
    ...levels.flatMap((n) => [`visits${n}Random`, `visits${n}Quadrature`, `hours${n}Random`, `hours${n}Quadrature`]),
    'plannedVisits',
    'sigmaKRandomMps',
    'probabilityRandom',
    'probabilityQuadrature',
    'massMinRandomEarth',
    'massMinQuadratureEarth',
    'mass50RandomEarth',
    'mass90RandomEarth',
    'snrPerPixel',
    'jitterSource',
    'verdict',
    'verdictText',
  ];
  const body = rows.map((r) => {
    const b = r.exposure.budget;
    const p = r.atPlannedVisits;
    return [
      r.targetId,
      r.vmag,
      r.teffK,
      r.massSun,
      r.planet?.source,
      r.planet?.msiniEarth,
      r.planet?.periodDays,
      r.planet?.ecc,
      r.planet?.kMps,
      r.exposure.exposureSec,
      String(r.exposure.tooFaint),
      b.photonSigmaMps,
      b.visitSigmaMps,
      b.effectiveSigmaMps,
      r.visitCostSec,
      ...levels.flatMap((n) => {
        const v = r.needed.find((x) => x.goalSignificance === n);
        return [v?.random, v?.quadrature, v?.hoursRandom, v?.hoursQuadrature];
      }),
      p?.visits,
      p?.sigmaKRandomMps,
      p?.probabilityRandom,
      p?.probabilityQuadrature,
      p?.massMinRandomEarth,
      p?.massMinQuadratureEarth,
      p?.mass50RandomEarth,
      p?.mass90RandomEarth,
      b.snrPerPixel,
      r.jitterSource,
      r.verdict.level,
      r.verdict.text,
    ];
  });
  return toCsv(header, body);
}

export function registerDetect(program: Command): Command {
  const command = program
    .command('detect')
    .description("detectability of each target's planet (or a hypothetical one): K, sigma, visits and hours needed, verdict")
    .option('--targets <FILE>', 'target list (CSV); or give one star with --vmag and --teff')
    .option('--name <NAME>', 'name of the one star given with --vmag and --teff', 'star')
    .requiredOption('--instrument <ID>', 'instrument profile: a bundled id or a path')
    .option('--significance <N>', 'K/sigma_K to reach', numberFlag('--significance', 'a number from 1 to 50', 1, 50), 5)
    .option(
      '--visits <N>',
      'a planned number of visits: detection probability and mass limits at that N',
      numberFlag('--visits', 'a whole number from 2 to 100000', 2, 1e5, { integer: true }),
    )
    .option(
      '--planet-mass <MEARTH>',
      'hypothetical planet around every star: m sin i, in --mass-unit',
      numberFlag('--planet-mass', 'a mass more than 0 and at most 30000', 0, 3e4, { exclusiveMin: true }),
    )
    .option(
      '--mass-unit <unit>',
      'unit of --planet-mass and of the masses the table prints: earth (M⊕) or jupiter (MJup); --json and --csv stay in M⊕',
      choiceFlag('--mass-unit', MASS_UNITS),
      'earth',
    )
    .option('--period <DAYS>', 'hypothetical planet: orbital period (days)', numberFlag('--period', 'days, from 0.01 to 100000', 0.01, 1e5))
    .option('--ecc <E>', 'hypothetical planet: eccentricity (default 0)', numberFlag('--ecc', 'an eccentricity from 0 to 0.99', 0, 0.99));
  addStarFlags(command);
  addExposureFlags(command);
  return command
    .option('--json', 'print one JSON document')
    .option('--csv', 'print CSV (one row per target)')
    .action((opts: DetectFlags) => {
      const options = detectOptions(opts);
      const instrument = instrumentFromFlag(opts.instrument);
      const rows = stars(opts).map((star) => targetDetectability(star, instrument, options));
      if (opts.json) {
        const { file: _file, ...profile } = instrument;
        return printJson({ instrument: profile, options, targets: rows });
      }
      if (opts.csv) return void process.stdout.write(csvRows(rows, options));
      console.log(`Instrument: ${instrument.id} (${instrument.name}); airmass ${options.airmass}; goal K/sigma_K = ${options.goalSignificance}`);
      console.log('');
      printTable(rows, options, opts.massUnit);
      printNotes(rows);
      printLimits(rows, options, opts.massUnit);
      if (options.visits === undefined) console.log('\nAdd --visits N for detection probabilities and the smallest detectable m sin i at N visits.');
    });
}

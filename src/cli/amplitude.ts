import type { Command } from 'commander';
import { inputError } from '../errors.js';
import { planetMassFromKApproxEarth, planetMassFromKEarth } from '../orbit/minimum-mass.js';
import { summarizeOrbit, type OrbitSummary } from '../orbit/summary.js';
import { MASS_SYMBOL, MASS_UNITS, type MassUnit, massInEarth, massInUnit } from '../report/mass-unit.js';
import { renderTable } from '../report/table.js';
import { choiceFlag, numberFlag, printJson } from './options.js';

interface AmplitudeOptions {
  starMass?: number;
  planetMass?: number;
  massUnit: MassUnit;
  k?: number;
  period?: number;
  ecc: number;
  incl: number;
  json?: boolean;
}

function required<T>(value: T | undefined, flag: string, allowed: string): T {
  if (value === undefined) throw inputError({ file: 'command line', field: flag, value: undefined, allowed: `required: ${allowed}` });
  return value;
}

/** Five significant figures, without exponent notation for ordinary magnitudes. */
const sig = (value: number) => String(Number(value.toPrecision(5)));

function rowsFor(s: OrbitSummary, inverse: { massSinIApproxEarth: number } | undefined): string[][] {
  const mass = (label: string, earth: number) => [
    [label, sig(earth), MASS_SYMBOL.earth],
    ['', sig(massInUnit(earth, 'jupiter')), MASS_SYMBOL.jupiter],
  ];
  const rows: string[][] = [['semi-amplitude K', sig(s.kMps), 'm/s']];
  if (inverse) {
    rows.push(...mass('m sin i (exact)', s.msiniEarth));
    rows.push(...mass('m sin i (if m << M*)', inverse.massSinIApproxEarth));
    if (s.inclinationDeg !== 90) rows.push(...mass('planet mass m', s.massEarth));
  } else {
    rows.push(...mass('planet mass m', s.massEarth));
    if (s.inclinationDeg !== 90) rows.push(...mass('m sin i', s.msiniEarth));
  }
  rows.push(
    ['semi-major axis a', sig(s.semiMajorAxisAu), 'au'],
    ["star's orbit a*", sig(s.starOrbitRadiusKm), 'km'],
    ['a* sin i', sig(s.starOrbitProjectedKm), 'km'],
    ["planet's orbital speed", sig(s.planetSpeedKmps), 'km/s'],
    ["star's orbital speed", sig(s.starSpeedMps), 'm/s'],
  );
  return rows;
}

export function registerAmplitude(program: Command): Command {
  return program
    .command('amplitude')
    .description("the star's reflex semi-amplitude K from a planet's mass, or the minimum mass m sin i from K")
    .option('--star-mass <msun>', 'stellar mass in solar masses', numberFlag('--star-mass', 'a stellar mass in solar masses, from 0.01 to 100', 0.01, 100))
    .option(
      '--planet-mass <mass>',
      'planet mass, in --mass-unit',
      numberFlag('--planet-mass', 'a planet mass, more than 0 and at most 1e7', 0, 1e7, { exclusiveMin: true }),
    )
    .option('--mass-unit <unit>', 'unit of --planet-mass: earth or jupiter', choiceFlag('--mass-unit', MASS_UNITS), 'earth')
    .option(
      '--k <mps>',
      'semi-amplitude K in m/s (instead of --planet-mass): gives m sin i',
      numberFlag('--k', 'a semi-amplitude in m/s, more than 0 and at most 1e6', 0, 1e6, { exclusiveMin: true }),
    )
    .option('--period <days>', 'orbital period in days', numberFlag('--period', 'a period in days, from 0.01 to 1e7', 0.01, 1e7))
    .option('--ecc <e>', 'eccentricity', numberFlag('--ecc', 'an eccentricity from 0 to 0.99 (e >= 1 is not a bound orbit)', 0, 0.99), 0)
    .option('--incl <deg>', 'inclination in degrees (90 = edge-on)', numberFlag('--incl', 'an inclination in degrees, from 0.1 to 90', 0.1, 90), 90)
    .option('--json', 'print one JSON document')
    .action((opts: AmplitudeOptions) => {
      const starMassSun = required(opts.starMass, '--star-mass', 'stellar mass in solar masses');
      const periodDays = required(opts.period, '--period', 'orbital period in days');
      if ((opts.planetMass === undefined) === (opts.k === undefined)) {
        const both = opts.k !== undefined;
        throw inputError({
          file: 'command line',
          field: both ? '--k' : '--planet-mass',
          value: both ? opts.k : undefined,
          allowed: both ? 'give --planet-mass or --k, not both' : 'give --planet-mass (forward) or --k in m/s (inverse)',
        });
      }
      const orbit = { starMassSun, periodDays, ecc: opts.ecc, inclinationDeg: opts.incl };
      let inverse: { massSinIApproxEarth: number; massSinIApproxJupiter: number } | undefined;
      let planetMassEarth: number;
      if (opts.k !== undefined) {
        planetMassEarth = planetMassFromKEarth({ ...orbit, kMps: opts.k });
        const massSinIApproxEarth = planetMassFromKApproxEarth({ ...orbit, kMps: opts.k }) * Math.sin((opts.incl * Math.PI) / 180);
        inverse = { massSinIApproxEarth, massSinIApproxJupiter: massInUnit(massSinIApproxEarth, 'jupiter') };
      } else {
        planetMassEarth = massInEarth(opts.planetMass!, opts.massUnit);
      }
      const summary = summarizeOrbit({ ...orbit, planetMassEarth });
      if (opts.json) return printJson({ mode: inverse ? 'inverse' : 'forward', ...summary, ...inverse });
      console.log(
        `${inverse ? `Minimum mass from K = ${sig(opts.k!)} m/s` : 'Semi-amplitude K of the star'}: M* = ${sig(starMassSun)} Msun, ` +
          `P = ${sig(periodDays)} d, e = ${sig(opts.ecc)}, i = ${sig(opts.incl)} deg${opts.incl === 90 ? ' (edge-on)' : ''}`,
      );
      console.log(renderTable([{ header: 'quantity' }, { header: 'value', align: 'right' }, { header: 'unit' }], rowsFor(summary, inverse)));
      console.log('Speeds are barycentric, where the separation equals a (exact for a circular orbit).');
    });
}

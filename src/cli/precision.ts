import type { Command } from 'commander';
import { inputError } from '../errors.js';
import { instrumentFromFlag } from '../io/site-list.js';
import type { Instrument } from '../rv/instrument.js';
import { fmt, renderTable } from '../report/table.js';
import { chooseExposureSec, fixedExposure, visitCostSec, type ExposureChoice } from '../rv/exposure.js';
import type { PrecisionBudget } from '../rv/precision.js';
import type { BandId } from '../rv/bands.js';
import { defaultJitter } from '../rv/jitter.js';
import { DEFAULT_VSINI_KMS, massFromTeffSun } from '../rv/star-defaults.js';
import { TYPICAL_AIRMASS, type DetectStar } from '../rv/target-detect.js';
import { numberFlag, printJson } from './options.js';

/** Star flags shared by `crest precision` and `crest detect` (one star given on the command line). */
export interface StarFlags {
  vmag?: number;
  teff?: number;
  vsini?: number;
  jitter?: number;
  starMass?: number;
  logg?: number;
  logRhk?: number;
  rmag?: number;
  imag?: number;
  jmag?: number;
  hmag?: number;
  gmag?: number;
}

/** Magnitude flags other than V, by band. */
const BAND_FLAGS: [BandId, 'rmag' | 'imag' | 'jmag' | 'hmag' | 'gmag'][] = [
  ['R', 'rmag'],
  ['I', 'imag'],
  ['J', 'jmag'],
  ['H', 'hmag'],
  ['G', 'gmag'],
];

export function addStarFlags(command: Command): Command {
  command
    .option('--vmag <V>', 'V magnitude', numberFlag('--vmag', 'a V magnitude from -2 to 20', -2, 20))
    .option('--teff <K>', 'effective temperature (K)', numberFlag('--teff', 'kelvin from 2300 to 12000', 2300, 12000))
    .option('--vsini <KMS>', `projected rotation v sin i (km/s; default ${DEFAULT_VSINI_KMS})`, numberFlag('--vsini', 'km/s from 0 to 300', 0, 300))
    .option('--jitter <MPS>', "stellar jitter (m/s; default from Teff, v sin i, log R'HK and log g)", numberFlag('--jitter', 'm/s from 0 to 1000', 0, 1000))
    .option(
      '--star-mass <MSUN>',
      'stellar mass (solar masses; default from Teff on the dwarf sequence)',
      numberFlag('--star-mass', 'solar masses, more than 0.05 and at most 10', 0.05, 10, { exclusiveMin: true }),
    )
    .option('--logg <DEX>', 'surface gravity log g (cgs; default a dwarf of this Teff)', numberFlag('--logg', 'log g from 0 to 6', 0, 6))
    .option('--log-rhk <DEX>', "chromospheric activity log R'HK", numberFlag('--log-rhk', "log R'HK from -6 to -3.5", -6, -3.5));
  for (const [band, key] of BAND_FLAGS) {
    command.option(`--${key} <MAG>`, `${band} magnitude (default from V and Teff, dwarf colours)`, numberFlag(`--${key}`, 'a magnitude from -4 to 21', -4, 21));
  }
  return command;
}

/** The star from the flags, with the documented defaults (src/rv/star-defaults.ts, jitter.ts) flagged as estimated. */
export function starFromFlags(flags: StarFlags, id: string): DetectStar {
  for (const [name, value] of [
    ['--vmag', flags.vmag],
    ['--teff', flags.teff],
  ] as const) {
    if (value === undefined)
      throw inputError({ file: 'command line', field: name, value: undefined, allowed: 'required for a star given on the command line' });
  }
  const teffK = flags.teff!;
  const estimated: string[] = [];
  const orDefault = (value: number | undefined, name: string, fallback: number) => {
    if (value !== undefined) return value;
    estimated.push(name);
    return fallback;
  };
  const jitter = defaultJitter({ teffK, vsiniKms: flags.vsini, logRhk: flags.logRhk, logg: flags.logg });
  const mags: Partial<Record<BandId, number>> = {};
  for (const [band, key] of BAND_FLAGS) if (flags[key] !== undefined) mags[band] = flags[key];
  const star: DetectStar = {
    id,
    vmag: flags.vmag!,
    teffK,
    massSun: orDefault(flags.starMass, 'massSun', massFromTeffSun(teffK)),
    vsiniKms: orDefault(flags.vsini, 'vsiniKms', DEFAULT_VSINI_KMS),
    jitterMps: orDefault(flags.jitter, 'jitterMps', jitter.jitterMps),
    jitterSource: flags.jitter === undefined ? jitter.source : 'as given',
    mags,
    estimated,
  };
  if (flags.logg !== undefined) star.logg = flags.logg;
  if (flags.logRhk !== undefined) star.logRhk = flags.logRhk;
  return star;
}

/** Exposure and σ flags shared by `crest precision` and `crest detect`. */
export function addExposureFlags(command: Command): Command {
  return command
    .option('--exposure <SEC>', 'fixed exposure time (s)', numberFlag('--exposure', 'seconds from 1 to 100000', 1, 1e5))
    .option(
      '--target-sigma <MPS>',
      'choose the exposure reaching this sigma per visit (photon + floor, m/s)',
      numberFlag('--target-sigma', 'm/s, more than 0 and at most 10000', 0, 1e4, { exclusiveMin: true }),
    )
    .option('--airmass <X>', 'airmass of the visit', numberFlag('--airmass', 'an airmass from 1 to 10', 1, 10), TYPICAL_AIRMASS)
    .option(
      '--seeing <ARCSEC>',
      "seeing FWHM at the zenith (arcsec; default the instrument's reference seeing)",
      numberFlag('--seeing', 'arcsec from 0.2 to 5', 0.2, 5),
    );
}

export function checkExposureFlags(opts: { exposure?: number; targetSigma?: number }): void {
  if (opts.exposure !== undefined && opts.targetSigma !== undefined) {
    throw inputError({
      file: 'command line',
      field: '--target-sigma',
      value: String(opts.targetSigma),
      allowed: 'give --exposure or --target-sigma, not both',
    });
  }
}

const GOAL_TEXT: Record<ExposureChoice['goal'], string> = {
  'photon-at-noise-floor': 'the shortest at which photon noise is down to jitter and floor',
  'target-sigma': 'chosen for the requested sigma per visit',
  'fewest-hours': 'the fewest hours to the goal for this K',
  fixed: 'as given',
};

/** The budget as table rows: where the sigma of one visit comes from. */
function budgetRows(b: PrecisionBudget, instrument: Instrument, star: Pick<DetectStar, 'vsiniKms' | 'teffK' | 'jitterSource' | 'estimated'>): string[][] {
  const ref = instrument.reference;
  const f = b.factors;
  const times = (x: number) => `x ${x.toFixed(3)}`;
  const snr = b.snr;
  return [
    [
      'reference photon noise',
      `${fmt(b.referencePhotonSigmaMps, 2)} m/s`,
      `${instrument.band} = ${ref.mag}, ${ref.exposureSec} s, Teff ${ref.teffK} K, v sin i ${ref.vsiniKms} km/s, ` +
        `airmass ${ref.airmass}, S/N ${ref.snrPerPixel}`,
    ],
    [
      'magnitude',
      times(f.magnitude),
      `10^(0.2 (m - m_ref)), ${b.band} = ${fmt(b.mag, 2)}${b.magEstimated ? ' (estimated from V and Teff, dwarf colours)' : ''}`,
    ],
    ['exposure', times(f.exposure), `(t / t_ref)^(-1/2), t = ${b.exposureSec} s`],
    ['aperture', times(f.aperture), `(D / D_ref)^(-1), D = ${b.apertureM} m, D_ref = ${instrument.apertureM} m`],
    [
      'extinction',
      times(f.extinction),
      `10^(0.2 k (X - X_ref)), k = ${instrument.extinctionMagPerAirmass} mag at ${instrument.wavelengthNm} nm, X = ${b.airmass}`,
    ],
    ['entrance', times(f.entrance), `seeing ${fmt(snr.seeingArcsec, 2)}" at this airmass, ${fmt(100 * snr.coupling, 0)}% into the ${instrument.entrance.kind}`],
    ['sky and read noise', times(f.detector), `sky ${fmt(snr.skyElectrons, 1)} e-, read variance ${fmt(snr.readVarianceE2, 0)} e-^2 per pixel`],
    ['line width', times(f.lineWidth), `rotation: v sin i = ${star.vsiniKms} km/s, w0 = ${fmt(b.lineWidthKms, 1)} km/s at R = ${instrument.resolvingPower}`],
    ['spectral type', times(f.spectralType), `Teff = ${star.teffK} K, ${b.spectralTypeSource}`],
    ['S/N per pixel', fmt(b.snrPerPixel, 1), `at ${b.snrWavelengthNm} nm: star ${fmt(snr.starElectrons, 0)} e- per pixel`],
    ['photon noise', `${fmt(b.photonSigmaMps, 2)} m/s`, 'the product of the factors above'],
    ['instrument floor', `${fmt(b.floorMps, 2)} m/s`, 'systematics; does not average down'],
    ['sigma per visit', `${fmt(b.visitSigmaMps, 2)} m/s`, 'photon and floor in quadrature'],
    ['stellar jitter', `${fmt(b.jitterMps, 2)} m/s`, star.jitterSource ?? (star.estimated.includes('jitterMps') ? 'default' : 'as given')],
    ['effective sigma', `${fmt(b.effectiveSigmaMps, 2)} m/s`, 'visit and jitter in quadrature: the scatter about the orbit'],
  ];
}

export function registerPrecision(program: Command): Command {
  const command = program
    .command('precision')
    .description('RV precision of one visit, or the exposure needed, with the full noise budget')
    .requiredOption('--instrument <ID>', 'instrument profile: a bundled id or a path');
  addStarFlags(command);
  addExposureFlags(command);
  return command
    .option(
      '--aperture <M>',
      "same spectrograph on a telescope of this aperture (m; default the instrument's own)",
      numberFlag('--aperture', 'metres, more than 0 and at most 50', 0, 50, { exclusiveMin: true }),
    )
    .option('--json', 'print one JSON document')
    .action(
      (
        opts: StarFlags & { instrument: string; exposure?: number; targetSigma?: number; airmass: number; seeing?: number; aperture?: number; json?: boolean },
      ) => {
        checkExposureFlags(opts);
        const instrument = instrumentFromFlag(opts.instrument);
        // The precision model does not use the star's mass; leave it out.
        const { massSun: _massSun, ...withMass } = starFromFlags(opts, 'star');
        const star = { ...withMass, estimated: withMass.estimated.filter((name) => name !== 'massSun') };
        const options = { apertureM: opts.aperture, seeingArcsec: opts.seeing };
        const choice =
          opts.exposure === undefined
            ? chooseExposureSec(instrument, star, opts.airmass, opts.targetSigma, options)
            : fixedExposure(instrument, star, opts.airmass, opts.exposure, options);
        const costSec = visitCostSec(instrument, choice.exposureSec);
        if (opts.json) {
          const { file: _file, ...profile } = instrument;
          return printJson({ instrument: profile, star, exposure: choice, visitCostSec: costSec });
        }
        console.log(`Instrument: ${instrument.id} (${instrument.name})`);
        const est = star.estimated.length ? ` (defaults: ${star.estimated.join(', ')})` : '';
        console.log(`Star: V = ${star.vmag}, Teff ${star.teffK} K, v sin i ${star.vsiniKms} km/s, jitter ${fmt(star.jitterMps, 2)} m/s${est}`);
        const clip = choice.clippedTo ? `, clipped to the instrument's ${choice.clippedTo}imum` : '';
        console.log(`Exposure: ${choice.exposureSec} s (${GOAL_TEXT[choice.goal]}${clip}); visit with readout and acquisition: ${costSec} s`);
        if (choice.minimumReason === 'oscillations')
          console.log(
            `Shortest exposure: ${choice.minimumSec} s, one p-mode period 1/nu_max for this Teff and log g, so oscillations average out [Chaplin2019]`,
          );
        console.log(`S/N per pixel at ${choice.budget.snrWavelengthNm} nm: ${fmt(choice.budget.snrPerPixel, 1)}`);
        console.log('');
        console.log(renderTable([{ header: 'term' }, { header: 'value', align: 'right' }, { header: 'how' }], budgetRows(choice.budget, instrument, star)));
        for (const warning of [choice.budget.teffWarning, choice.warning]) if (warning) console.log(`\nWarning: ${warning}`);
      },
    );
}

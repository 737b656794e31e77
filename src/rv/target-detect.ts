// One target's detectability on one instrument: its planet (given, searched for, or
// hypothetical), the exposure and σ per visit, visits and hours needed, and a plain verdict.

import type { Target } from '../model.js';
import type { Instrument } from './instrument.js';
import { semiAmplitudeMps } from '../orbit/semi-amplitude.js';
import { detectionProbability, floorOnKMps, massLimitTable, PHASE_LAYOUTS, sigmaKMps, visitsNeeded, type MassLimitRow, type PhaseLayout } from './detect.js';
import { chooseExposureSec, fixedExposure, visitCostSec, type ExposureChoice } from './exposure.js';

/** Airmass assumed when none is given: a target observed reasonably high (common practice). */
export const TYPICAL_AIRMASS = 1.2;
/** More visits than this for the goal at random phases: out of reach (Crest's choice). */
export const OUT_OF_REACH_VISITS = 200;
/** More visits than this: demanding, about a semester's allocation for one star (Crest's choice). */
export const DEMANDING_VISITS = 50;

/** What detectability needs of a target: a Target, or a star given on the command line. */
export type DetectStar = Pick<Target, 'id' | 'vmag' | 'teffK' | 'massSun' | 'vsiniKms' | 'jitterMps' | 'estimated'> &
  Partial<Pick<Target, 'planet' | 'ephemeris' | 'search' | 'mags' | 'logg' | 'logRhk' | 'exposureSec' | 'visitSigmaMps' | 'jitterSource' | 'source'>>;

export interface DetectPlanet {
  source: 'given' | 'search' | 'hypothetical';
  msiniEarth?: number;
  kMps: number;
  periodDays: number;
  ecc: number;
  /** How the planet was made up, in words. */
  note: string;
}

export interface HypotheticalPlanet {
  msiniEarth: number;
  periodDays: number;
  ecc?: number;
}

/**
 * The planet to test for a target: the hypothetical one when given; else the target's planet
 * (mass → K with semiAmplitudeMps, or K as given); else its search spec, at the search mass and
 * the logarithmic middle √(Pmin · Pmax) of the period range (the median of a log-uniform period
 * prior); else none.
 */
export function planetOfTarget(target: DetectStar, hypothetical?: HypotheticalPlanet): DetectPlanet | undefined {
  const kOf = (msiniEarth: number, periodDays: number, ecc: number) =>
    semiAmplitudeMps({ starMassSun: target.massSun, planetMassEarth: msiniEarth, periodDays, ecc });
  if (hypothetical) {
    const ecc = hypothetical.ecc ?? 0;
    return {
      source: 'hypothetical',
      msiniEarth: hypothetical.msiniEarth,
      kMps: kOf(hypothetical.msiniEarth, hypothetical.periodDays, ecc),
      periodDays: hypothetical.periodDays,
      ecc,
      note: `hypothetical ${hypothetical.msiniEarth} M⊕ at P = ${hypothetical.periodDays} d`,
    };
  }
  const { planet, ephemeris, search } = target;
  if (planet && ephemeris) {
    const periodDays = ephemeris.periodDays;
    if (planet.kMps !== undefined) return { source: 'given', kMps: planet.kMps, periodDays, ecc: planet.ecc, note: `K = ${planet.kMps} m/s as given` };
    const msiniEarth = planet.msiniEarth!;
    return {
      source: 'given',
      msiniEarth,
      kMps: kOf(msiniEarth, periodDays, planet.ecc),
      periodDays,
      ecc: planet.ecc,
      note: `${msiniEarth} M⊕ at P = ${periodDays} d`,
    };
  }
  if (search) {
    const periodDays = Math.sqrt(search.periodMinDays * search.periodMaxDays);
    return {
      source: 'search',
      msiniEarth: search.msiniEarth,
      kMps: kOf(search.msiniEarth, periodDays, 0),
      periodDays,
      ecc: 0,
      note:
        `search: ${search.msiniEarth} M⊕ at P = ${periodDays.toFixed(1)} d, ` + `the logarithmic middle of ${search.periodMinDays}-${search.periodMaxDays} d`,
    };
  }
  return undefined;
}

export interface DetectOptions {
  /** K/σ_K to reach (the goal); visits are also reported for 3 and 5. */
  goalSignificance: number;
  airmass: number;
  /** Fixed exposure (s); otherwise chooseExposureSec picks one. A target's own exposureSec wins. */
  exposureSec?: number;
  /** Requested σ_visit for the exposure choice. A target's own visitSigmaMps wins. */
  targetVisitSigmaMps?: number;
  /** Zenith seeing (arcsec), e.g. the site's median. */
  seeingArcsec?: number;
  /** A planet number of visits: σ_K, detection probability and mass limits at that N. */
  visits?: number;
  hypothetical?: HypotheticalPlanet;
  /** Period grid for the mass-limit table (needs `visits`). */
  periodsDays?: readonly number[];
}

export interface VisitsAt {
  goalSignificance: number;
  random: number;
  quadrature: number;
  hoursRandom: number;
  hoursQuadrature: number;
}

export interface AtPlannedVisits {
  visits: number;
  sigmaKRandomMps: number;
  sigmaKQuadratureMps: number;
  /** P(K̂/σ_K > n) at random phases (averaged over them) and at quadratures; undefined without a planet. */
  probabilityRandom?: number;
  probabilityQuadrature?: number;
  /** Smallest detectable m sin i at the planet's period (random phases, quadratures). */
  massMinRandomEarth?: number;
  massMinQuadratureEarth?: number;
  /** m sin i at the planet's period detected in 50% and 90% of campaigns at random phases. */
  mass50RandomEarth?: number;
  mass90RandomEarth?: number;
  massLimits?: MassLimitRow[];
}

export type VerdictLevel = 'feasible' | 'demanding' | 'out of reach' | 'no planet';

export interface TargetDetectability {
  targetId: string;
  vmag: number;
  teffK: number;
  massSun: number;
  estimated: string[];
  /** How the jitter was found ("as given", or the relations behind the default). */
  jitterSource?: string;
  planet?: DetectPlanet;
  exposure: ExposureChoice;
  /** σ_eff per visit (m/s): photon, floor and jitter in quadrature. */
  effectiveSigmaMps: number;
  /** The part of σ that averages down over visits (photon and jitter), and the floor that does not (m/s). */
  whiteSigmaMps: number;
  floorMps: number;
  /** The largest term of σ_eff. */
  dominantNoise: 'photon' | 'floor' | 'jitter';
  visitCostSec: number;
  /** Visits and hours for 3σ, 5σ and the goal (deduplicated, ascending); empty without a planet. */
  needed: VisitsAt[];
  atPlannedVisits?: AtPlannedVisits;
  verdict: { level: VerdictLevel; text: string };
}

/** Detectability of one target's planet on one instrument (see the interfaces above). */
export function targetDetectability(target: DetectStar, instrument: Instrument, options: DetectOptions): TargetDetectability {
  const planet = planetOfTarget(target, options.hypothetical);
  const exposureSec = target.exposureSec ?? options.exposureSec;
  const precisionOptions = { seeingArcsec: options.seeingArcsec, kMps: planet?.kMps, goalSignificance: options.goalSignificance };
  const exposure =
    exposureSec === undefined
      ? chooseExposureSec(instrument, target, options.airmass, target.visitSigmaMps ?? options.targetVisitSigmaMps, precisionOptions)
      : fixedExposure(instrument, target, options.airmass, exposureSec, precisionOptions);
  const { budget } = exposure;
  const effectiveSigmaMps = budget.effectiveSigmaMps;
  const costSec = visitCostSec(instrument, exposure.exposureSec);
  const hours = (visits: number) => (visits * costSec) / 3600;
  const levels = [...new Set([3, 5, options.goalSignificance])].sort((a, b) => a - b);
  const needed: VisitsAt[] = planet
    ? levels.map((n) => {
        const [random, quadrature] = PHASE_LAYOUTS.map((layout) => visitsNeeded(planet.kMps, budget.whiteSigmaMps, n, layout, budget.floorMps)) as [
          number,
          number,
        ];
        return { goalSignificance: n, random, quadrature, hoursRandom: hours(random), hoursQuadrature: hours(quadrature) };
      })
    : [];
  const terms = { photon: budget.photonSigmaMps, floor: budget.floorMps, jitter: budget.jitterMps };
  const dominantNoise = (Object.keys(terms) as (keyof typeof terms)[]).reduce((a, b) => (terms[b] > terms[a] ? b : a));
  const result: TargetDetectability = {
    targetId: target.id,
    vmag: target.vmag,
    teffK: target.teffK,
    massSun: target.massSun,
    estimated: target.estimated,
    jitterSource: target.jitterSource,
    planet,
    exposure,
    effectiveSigmaMps,
    whiteSigmaMps: budget.whiteSigmaMps,
    floorMps: budget.floorMps,
    dominantNoise,
    visitCostSec: costSec,
    needed,
    verdict: { level: 'no planet', text: '' },
  };
  if (options.visits !== undefined) result.atPlannedVisits = atPlannedVisits(result, options);
  result.verdict = verdict(result, instrument, options.goalSignificance, target.ephemeris !== undefined && planet?.source === 'given');
  return result;
}

function atPlannedVisits(row: TargetDetectability, options: DetectOptions): AtPlannedVisits {
  const visits = options.visits!;
  const n = options.goalSignificance;
  const { whiteSigmaMps, floorMps } = row;
  const sigmaK = (layout: PhaseLayout) => sigmaKMps(whiteSigmaMps, visits, layout, floorOnKMps(floorMps, n));
  const at: AtPlannedVisits = { visits, sigmaKRandomMps: sigmaK('random'), sigmaKQuadratureMps: sigmaK('quadrature') };
  const planet = row.planet;
  const limits = (periodsDays: readonly number[], ecc: number) =>
    massLimitTable({ starMassSun: row.massSun, whiteSigmaMps, floorMps, visits, goalSignificance: n, periodsDays, ecc });
  if (planet) {
    at.probabilityRandom = detectionProbability(planet.kMps, whiteSigmaMps, visits, n, 'random', floorMps);
    at.probabilityQuadrature = detectionProbability(planet.kMps, whiteSigmaMps, visits, n, 'quadrature', floorMps);
    const [limit] = limits([planet.periodDays], planet.ecc);
    at.massMinRandomEarth = limit!.massMinRandomEarth;
    at.massMinQuadratureEarth = limit!.massMinQuadratureEarth;
    at.mass50RandomEarth = limit!.mass50RandomEarth;
    at.mass90RandomEarth = limit!.mass90RandomEarth;
  }
  if (options.periodsDays) at.massLimits = limits(options.periodsDays, planet?.ecc ?? 0);
  return at;
}

function verdict(row: TargetDetectability, instrument: Instrument, goalSignificance: number, phaseKnown: boolean): { level: VerdictLevel; text: string } {
  const notes = [row.exposure.warning, row.dominantNoise === 'jitter' ? 'jitter-limited: longer exposures barely help' : undefined].filter((x) => x);
  const withNotes = (level: VerdictLevel, text: string) => ({ level, text: [text, ...notes].join('; ') });
  const planet = row.planet;
  if (!planet) return withNotes('no planet', 'no planet mass, K or search given: precision only');
  const k = planet.kMps.toFixed(2);
  if (planet.kMps <= instrument.floorMps) {
    return withNotes('out of reach', `K = ${k} m/s is below the instrument floor of ${instrument.floorMps} m/s, which does not average down over visits`);
  }
  const goal = row.needed.find((v) => v.goalSignificance === goalSignificance)!;
  const n = `${goalSignificance} sigma`;
  const quad = `${goal.quadrature} (${goal.hoursQuadrature.toFixed(1)} h) at quadratures`;
  if (goal.random > OUT_OF_REACH_VISITS) {
    if (goal.quadrature <= OUT_OF_REACH_VISITS && phaseKnown) {
      return withNotes(
        'demanding',
        `only with visits timed at quadrature: ${quad} for ${n}; random phases would need ${goal.random} (more than ${OUT_OF_REACH_VISITS})`,
      );
    }
    const why = goal.quadrature > OUT_OF_REACH_VISITS ? `and ${goal.quadrature} even at ideal quadratures` : `${quad}, but the orbital phase is not known`;
    return withNotes(
      'out of reach',
      `K = ${k} m/s against sigma ${row.effectiveSigmaMps.toFixed(2)} m/s per visit needs ${goal.random} visits for ${n} at random phases ` +
        `(more than ${OUT_OF_REACH_VISITS}), ${why}`,
    );
  }
  const text = `${goal.random} visits (${goal.hoursRandom.toFixed(1)} h) for ${n} at random phases; ${quad}`;
  return withNotes(goal.random > DEMANDING_VISITS ? 'demanding' : 'feasible', text);
}

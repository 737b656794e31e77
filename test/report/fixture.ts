// A small invented campaign, built by hand with the model types, so the report's tests do not
// depend on the scheduler. Every star, site and value is made up. Night times are plausible for a
// site at 30° S in April (UTC−4), written as rounded clock times, not computed.

import type { Night, Site, Target } from '../../src/model.js';
import type { Campaign } from '../../src/plan/campaign.js';
import type { Instrument } from '../../src/rv/instrument.js';
import type { Plan, PlannedVisit, TargetSummary } from '../../src/plan/plan-schema.js';
import { phaseAt, phaseErrCycles } from '../../src/orbit/ephemeris.js';

const site: Site = {
  id: 'cerro-tolar',
  name: 'Cerro Tolar (invented)',
  latitudeDeg: -30.2,
  longitudeDeg: -70.8,
  elevationM: 2400,
  timeZone: 'America/Santiago',
  minAltitudeDeg: 20,
  clearFraction: 0.75,
  sourceNote: 'invented for the report tests',
  file: 'test/report/fixture.ts',
};

const instrument: Instrument = {
  id: 'tolar-echelle',
  name: 'Tolar echelle (invented)',
  apertureM: 3.6,
  resolvingPower: 100000,
  band: 'V',
  wavelengthNm: 550,
  coverageNm: [380, 690],
  spectralRegion: 'optical',
  reference: { photonSigmaMps: 1, mag: 8, exposureSec: 600, airmass: 1.2, seeingArcsec: 1, snrPerPixel: 100, teffK: 5300, vsiniKms: 2 },
  readNoiseE: 4,
  pixelsPerResolutionElement: 3.5,
  spatialPixels: 6,
  entrance: { kind: 'fibre', diameterArcsec: 1 },
  skyMagPerArcsec2: 21.7,
  floorMps: 0.5,
  readoutSec: 30,
  acquisitionSec: 120,
  minExposureSec: 60,
  maxExposureSec: 3600,
  extinctionMagPerAirmass: 0.15,
  sources: {},
  sourceNote: 'invented',
  file: 'test/report/fixture.ts',
};

function target(id: string, raDeg: number, decDeg: number, vmag: number, extra: Partial<Target>): Target {
  return {
    id,
    starId: id,
    raDeg,
    decDeg,
    pmRaMasYr: 0,
    pmDecMasYr: 0,
    epochYear: 2000,
    vmag,
    teffK: 5300,
    massSun: 0.9,
    vsiniKms: 2,
    jitterMps: 1.5,
    priority: 1,
    estimated: [],
    source: `fixture ${id}`,
    ...extra,
  };
}

export const TARGETS: Target[] = [
  target('Teyu-3', 160.5, -35.1, 10.2, {
    ephemeris: { periodDays: 3.2174, periodErrDays: 0.0004, tcBjdTdb: 2461480.3121, tcErrDays: 0.002 },
    planet: { msiniEarth: 14, ecc: 0, omegaDeg: 90 },
  }),
  target('Mirador-7', 185.2, -22.4, 9.4, {
    massSun: 1.02,
    teffK: 5800,
    ephemeris: { periodDays: 8.7032, periodErrDays: 0.004, tcBjdTdb: 2461472.905, tcErrDays: 0.004 },
    planet: { msiniEarth: 30, ecc: 0, omegaDeg: 90 },
  }),
  target('Alba', 201.7, -41.8, 7.1, { search: { periodMinDays: 2, periodMaxDays: 40, msiniEarth: 8 } }),
  target('Quena-2', 75.3, 12.5, 11.0, { priority: 0.5 }),
];

export const CAMPAIGN: Campaign = {
  name: 'Tolar test campaign',
  file: 'test/report/fixture.ts',
  site,
  instrument,
  targets: TARGETS,
  targetsFile: 'test/report/fixture.ts',
  window: { start: '2027-04-10', end: '2027-04-21' },
  time: { mode: 'choose-nights', nights: 5 },
  constraints: { twilight: 'nautical', maxAirmass: 2, moonSeparationDeg: 30, minSpacingHours: 20, sameNightSpacingHours: 2, minWindowMinutes: 30 },
  goals: { significance: 5, probability: 0.9, searchCompleteness: 0.5 },
  noise: { nightlyJitterFraction: 0.5 },
  transits: { confidence: 0.95, maxOrbitFraction: 0.2 },
  seed: 7,
  lostDates: [],
};

const at = (day: number, hh: number, mm: number) => new Date(Date.UTC(2027, 3, day, hh, mm));

/** Twelve evenings, 10 to 21 April 2027: sunset near 22:45 UTC, sunrise near 11:25 UTC the next day. */
export const NIGHTS: Night[] = Array.from({ length: 12 }, (_, i) => {
  const d = 10 + i;
  const sunset = at(d, 22, 46 - i);
  const sunrise = at(d + 1, 11, 22 + i);
  const shift = (base: Date, minutes: number) => new Date(base.getTime() + minutes * 60_000);
  const nautical = { dusk: shift(sunset, 52), dawn: shift(sunrise, -52) };
  return {
    localDate: `2027-04-${String(d).padStart(2, '0')}`,
    sunset,
    sunrise,
    civil: { dusk: shift(sunset, 25), dawn: shift(sunrise, -25) },
    nautical,
    astronomical: { dusk: shift(sunset, 80), dawn: shift(sunrise, -80) },
    darkStart: nautical.dusk,
    darkEnd: nautical.dawn,
    darkHours: (nautical.dawn.getTime() - nautical.dusk.getTime()) / 3.6e6,
    moon: { illumination: Math.abs(Math.cos((Math.PI * (d - 6)) / 29.5)), rise: null, set: null, upDuringDark: i % 3 !== 0 },
  };
});

const JD_UNIX_EPOCH = 2440587.5;

/** A visit as the scheduler would write it (BJD taken as JD(UTC) here: a fixture, not a reduction). */
function visit(starId: string, start: Date, exposureSec: number, airmass: number, visitSigmaMps: number): PlannedVisit {
  const t = TARGETS.find((x) => x.id === starId)!;
  const mid = new Date(start.getTime() + (exposureSec / 2) * 1000);
  const midBjdTdb = mid.getTime() / 86_400_000 + JD_UNIX_EPOCH;
  const localDate = `2027-04-${String(start.getUTCHours() < 12 ? start.getUTCDate() - 1 : start.getUTCDate()).padStart(2, '0')}`;
  const local = new Date(start.getTime() - 4 * 3.6e6).toISOString().replace('Z', '-04:00');
  const phases = t.ephemeris ? [{ targetId: starId, phase: phaseAt(t.ephemeris, midBjdTdb), phaseErr: phaseErrCycles(t.ephemeris, midBjdTdb) }] : [];
  return {
    starId,
    localDate,
    startUtc: start.toISOString(),
    startLocal: local,
    midBjdTdb,
    exposureSec,
    durationSec: exposureSec + 150,
    airmass,
    moonSeparationDeg: 60,
    phases,
    visitSigmaMps,
    effectiveSigmaMps: Math.hypot(visitSigmaMps, t.jitterMps),
    whiteSigmaMps: Math.hypot(visitSigmaMps, t.jitterMps * Math.SQRT1_2),
    snrPerPixel: 100 / visitSigmaMps,
  };
}

export const VISITS: PlannedVisit[] = [
  visit('Teyu-3', at(12, 0, 10), 900, 1.12, 2.1),
  visit('Mirador-7', at(12, 3, 5), 600, 1.05, 1.4),
  visit('Alba', at(12, 5, 40), 300, 1.08, 0.9),
  visit('Teyu-3', at(14, 1, 0), 900, 1.06, 2.0),
  visit('Alba', at(14, 4, 20), 300, 1.04, 0.9),
  visit('Mirador-7', at(14, 6, 30), 600, 1.22, 1.5),
  visit('Teyu-3', at(17, 0, 30), 900, 1.09, 2.1),
  visit('Mirador-7', at(17, 3, 40), 600, 1.03, 1.4),
  visit('Teyu-3', at(20, 1, 45), 900, 1.05, 2.0),
  visit('Alba', at(20, 5, 10), 300, 1.05, 0.9),
  visit('Mirador-7', at(20, 23, 50), 600, 1.3, 1.5),
];

const hours = (id: string) => VISITS.filter((v) => v.starId === id).reduce((s, v) => s + v.durationSec / 3600, 0);
const count = (id: string) => VISITS.filter((v) => v.starId === id).length;

export const SUMMARIES: TargetSummary[] = [
  {
    targetId: 'Teyu-3',
    starId: 'Teyu-3',
    kind: 'ephemeris',
    priority: 1,
    kMps: 5.9,
    visits: count('Teyu-3'),
    hours: hours('Teyu-3'),
    sigmaKMps: 4.5,
    kOverSigmaK: 1.3,
    goalSignificance: 5,
    goalProbability: 0.0,
    informationEfficiency: 0.1,
    phaseErrAtEnd: 0.0009,
    warnings: [],
  },
  {
    targetId: 'Mirador-7',
    starId: 'Mirador-7',
    kind: 'ephemeris',
    priority: 1,
    kMps: 8.5,
    visits: count('Mirador-7'),
    hours: hours('Mirador-7'),
    sigmaKMps: 2.0,
    kOverSigmaK: 4.2,
    goalSignificance: 5,
    goalProbability: 0.2,
    informationEfficiency: 0.55,
    phaseErrAtEnd: 0.002,
    warnings: [],
  },
  {
    targetId: 'Alba',
    starId: 'Alba',
    kind: 'search',
    priority: 1,
    kMps: 3.1,
    visits: count('Alba'),
    hours: hours('Alba'),
    sigmaKMps: 1.2,
    kOverSigmaK: 2.6,
    goalSignificance: 5,
    goalProbability: 0.05,
    warnings: [],
  },
  { targetId: 'Quena-2', starId: 'Quena-2', kind: 'monitor', priority: 0.5, visits: 0, hours: 0, warnings: ['never observable in the window'] },
];

/** The whole plan: visits on the evenings of 11, 13, 16, 19 and 20 April; 14 and 17 April are backups. */
export function fixturePlan(): Plan {
  const plannedDates = [...new Set(VISITS.map((v) => v.localDate))].sort();
  const exposureHours = VISITS.reduce((s, v) => s + v.exposureSec / 3600, 0);
  const totalHours = VISITS.reduce((s, v) => s + v.durationSec / 3600, 0);
  return {
    schemaVersion: 1,
    generator: 'crest 0.1.0',
    campaign: CAMPAIGN,
    nights: NIGHTS,
    plannedDates,
    backups: [
      { localDate: '2027-04-14', rank: 1, utilityGain: 0.12 },
      { localDate: '2027-04-17', rank: 2, utilityGain: 0.08 },
    ],
    visits: VISITS,
    targets: SUMMARIES,
    totals: { nights: plannedDates.length, visits: VISITS.length, exposureHours, overheadHours: totalHours - exposureHours, totalHours, utility: 2.4 },
    warnings: ['Quena-2: never observable in the window'],
  };
}

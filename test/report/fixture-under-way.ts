// The fixture campaign a month before its window, with RVs already taken: four of Teyu-3 on two
// instruments, generated exactly on a circular orbit plus a per-instrument offset (no noise), and
// three of Mirador-7 with a second planet, c, added, so a test can derive every folded point by
// hand; a fitted orbit for Teyu-3 and a peak for Alba. Invented.

import type { Target } from '../../src/model.js';
import type { ObservedVisit, OrbitUpdate, Plan } from '../../src/plan/plan-schema.js';
import { fixturePlan, TARGETS } from './fixture.js';

/** The fitted ephemeris and K of Teyu-3 (the catalogue: P 3.2174, Tc 2461480.3121, K 5.9). */
export const TEYU_FIT: OrbitUpdate = {
  points: 4,
  kMps: 6.1,
  kErrMps: 1.2,
  tcBjdTdb: 2461480.3131,
  tcErrDays: 0.0015,
  periodDays: 3.2176,
  periodErrDays: 0.0003,
  catalogue: { kMps: 5.9, tcBjdTdb: 2461480.3121, tcErrDays: 0.002, periodDays: 3.2174, periodErrDays: 0.0004 },
};

/** Offsets the RVs were made with, per instrument (m/s). */
export const GAMMA: Record<string, number> = { 'tolar-echelle': -12.5, 'vecino-spec': 31 };

/** [BJD_TDB, local evening, instrument, rvErr (m/s)] of each Teyu-3 RV (early March 2027, before the window). */
export const TEYU_RVS: [number, string, string, number][] = [
  [2461470.61, '2027-03-05', 'tolar-echelle', 1.8],
  [2461471.57, '2027-03-06', 'tolar-echelle', 2.2],
  [2461473.64, '2027-03-08', 'vecino-spec', 2.5],
  [2461474.59, '2027-03-09', 'vecino-spec', 1.9],
];

const MIRADOR_B = TARGETS.find((t) => t.id === 'Mirador-7')!;

/** A second planet of Mirador-7 (K 4.2 m/s, circular), not planned for (no visits of its own in the summary). */
export const MIRADOR_C: Target = {
  ...MIRADOR_B,
  id: 'Mirador-7 c',
  ephemeris: { periodDays: 1.9313, periodErrDays: 0.0002, tcBjdTdb: 2461471.204, tcErrDays: 0.002 },
  planet: { kMps: 4.2, ecc: 0, omegaDeg: 90 },
};

/** K of Mirador-7 (b) in the fixture's summary. */
export const MIRADOR_B_K = 8.5;

/** [BJD_TDB, local evening, instrument, rvErr (m/s)] of each Mirador-7 RV. */
export const MIRADOR_RVS: [number, string, string, number][] = [
  [2461471.66, '2027-03-06', 'tolar-echelle', 1.4],
  [2461473.71, '2027-03-08', 'tolar-echelle', 1.6],
  [2461475.69, '2027-03-10', 'tolar-echelle', 1.5],
];

// A circular orbit: v = −K sin 2π(t − Tc)/P (src/orbit/signal-shape.ts for e = 0).
const circular = (k: number, eph: { tcBjdTdb: number; periodDays: number }, bjd: number) =>
  -k * Math.sin((2 * Math.PI * (bjd - eph.tcBjdTdb)) / eph.periodDays);

function observed(starId: string, signal: (bjd: number) => number) {
  return ([bjd, localDate, instrument, rvErrorMps]: [number, string, string, number], i: number): ObservedVisit => ({
    targetId: starId,
    starId,
    midBjdTdb: bjd,
    midUtc: new Date((bjd - 2440587.5) * 86_400_000).toISOString(),
    localDate,
    instrument,
    // The fixture's exact data: offset plus the star's planets, no noise.
    rvMps: GAMMA[instrument]! + signal(bjd),
    rvErrorMps,
    whiteSigmaMps: Math.hypot(rvErrorMps, 1.5 * Math.SQRT1_2),
    source: `fixture ${starId} row ${i + 1}`,
  });
}

/** The fixture plan with Teyu-3's RVs so far, its fit (ephemeris and K in the campaign, as the planner leaves them) and Alba's peak. */
export function underWayPlan(): Plan {
  const plan = fixturePlan();
  const fit = TEYU_FIT;
  return {
    ...plan,
    observed: [
      ...TEYU_RVS.map(observed('Teyu-3', (bjd) => circular(fit.kMps, fit, bjd))),
      ...MIRADOR_RVS.map(observed('Mirador-7', (bjd) => circular(MIRADOR_B_K, MIRADOR_B.ephemeris!, bjd) + circular(4.2, MIRADOR_C.ephemeris!, bjd))),
    ],
    campaign: {
      ...plan.campaign,
      targets: [
        ...plan.campaign.targets.map((t) =>
          t.id === 'Teyu-3'
            ? {
                ...t,
                ephemeris: { ...t.ephemeris!, tcBjdTdb: fit.tcBjdTdb, tcErrDays: fit.tcErrDays, periodDays: fit.periodDays, periodErrDays: fit.periodErrDays },
                planet: { ...t.planet!, kMps: fit.kMps },
              }
            : t,
        ),
        MIRADOR_C,
      ],
    },
    targets: [
      ...plan.targets.map((s) =>
        s.targetId === 'Teyu-3'
          ? { ...s, kMps: fit.kMps, fit, priorVisits: 4, priorKOverSigmaK: 1.1 }
          : s.targetId === 'Alba'
            ? { ...s, peak: { periodDays: 5.43, kMps: 2.8, fap: 0.0004, significant: true } }
            : s,
      ),
      { targetId: MIRADOR_C.id, starId: 'Mirador-7', kind: 'ephemeris', priority: 1, kMps: 4.2, visits: 0, hours: 0, warnings: [] },
    ],
  };
}

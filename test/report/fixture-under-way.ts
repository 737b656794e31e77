// The fixture campaign two days before its window, with RVs already taken: four of Teyu-3 on two
// instruments, generated exactly on a circular orbit plus a per-instrument offset (no noise), so a
// test can derive every folded point by hand; a fitted orbit for Teyu-3 and a peak for Alba. Invented.

import type { ObservedVisit, OrbitUpdate, Plan } from '../../src/model.js';
import { fixturePlan } from './fixture.js';

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

function observed([bjd, localDate, instrument, rvErrMps]: [number, string, string, number], i: number): ObservedVisit {
  // A circular orbit: v = γ − K sin 2π(t − Tc)/P (the fixture's exact data; no noise).
  const rvMps = GAMMA[instrument]! - TEYU_FIT.kMps * Math.sin((2 * Math.PI * (bjd - TEYU_FIT.tcBjdTdb)) / TEYU_FIT.periodDays);
  const midUtc = new Date((bjd - 2440587.5) * 86_400_000).toISOString();
  return {
    targetId: 'Teyu-3', starId: 'Teyu-3', midBjdTdb: bjd, midUtc, localDate,
    instrument, rvMps, rvErrMps, sigmaWhiteMps: Math.hypot(rvErrMps, 1.5 * Math.SQRT1_2), source: `fixture row ${i + 1}`,
  };
}

/** The fixture plan with Teyu-3's RVs so far, its fit (ephemeris and K in the campaign, as the planner leaves them) and Alba's peak. */
export function underWayPlan(): Plan {
  const plan = fixturePlan();
  const fit = TEYU_FIT;
  return {
    ...plan,
    observed: TEYU_RVS.map(observed),
    campaign: {
      ...plan.campaign,
      targets: plan.campaign.targets.map((t) =>
        t.id === 'Teyu-3' ? { ...t, ephemeris: { ...t.ephemeris!, tcBjdTdb: fit.tcBjdTdb, tcErrDays: fit.tcErrDays, periodDays: fit.periodDays, periodErrDays: fit.periodErrDays }, planet: { ...t.planet!, kMps: fit.kMps } } : t,
      ),
    },
    targets: plan.targets.map((s) =>
      s.targetId === 'Teyu-3'
        ? { ...s, kMps: fit.kMps, fit, priorVisits: 4, priorKOverSigmaK: 1.1 }
        : s.targetId === 'Alba'
          ? { ...s, peak: { periodDays: 5.43, kMps: 2.8, fap: 0.0004, significant: true } }
          : s,
    ),
  };
}

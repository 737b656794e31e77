// Known-phase detection maps for a planet with a transit ephemeris: the probability that a
// weighted least-squares fit of K (phase fixed by the ephemeris, free offset) gives K̂/σ_K > n,
// per (period, m sin i) cell. Circular orbits, v = γ − K sin(2π φ), φ = (t − Tc)/P, with the
// phase taken as known: the analytic σ_K is the information model's (src/rv/information.ts) for
// K and γ alone; the simulated map draws the true Tc and P from their errors, so it shows what
// a stale ephemeris costs such a fit.
//
// Rows other than the ephemeris period answer "had the period been P, with the same transit
// time": the phases and their errors are recomputed from Tc at each P.

import type { Ephemeris } from '../model.js';
import { phaseAt } from '../orbit/ephemeris.js';
import { semiAmplitudeMps } from '../orbit/semi-amplitude.js';
import { buildStarModel } from './information-model.js';
import { informationVisits, kVariances } from './information.js';
import { detectionProbabilityKnownPhase } from './detect.js';
import { createRng, deriveSeed } from './random.js';

export interface KnownPhaseInput {
  /** Visit times (BJD_TDB days) and each visit's σ_eff with jitter (m/s). */
  timesBjdTdb: number[];
  rvErrorsMps: number[];
  ephemeris: Ephemeris;
  periodsDays: number[];
  msinisEarth: number[];
  starMassSun: number;
  /** The detection threshold n on K̂/σ_K. */
  goalSignificance: number;
}

export interface KnownPhaseMap {
  periodsDays: number[];
  msinisEarth: number[];
  goalSignificance: number;
  /** detection[i][j] at periodsDays[i], msinisEarth[j]. */
  detection: number[][];
  /** Expected σ_K of each period's row, m/s (infinite when the visits carry no information on K). */
  sigmaKMps: number[];
}

/** The ephemeris with a trial period in place of its own (the same Tc and errors). */
const atPeriod = (eph: Ephemeris, periodDays: number): Ephemeris => ({ ...eph, periodDays });

/**
 * σ_K (m/s) of the visits at period P for a fit of γ and K on the predicted phases: the
 * information model of one circular planet with its ephemeris held fixed, each visit on a night
 * of its own.
 */
export function expectedSigmaKMps(timesBjdTdb: number[], rvErrorsMps: number[], eph: Ephemeris): number {
  if (timesBjdTdb.length === 0) return Infinity;
  const span: [number, number] = [Math.min(...timesBjdTdb), Math.max(...timesBjdTdb)];
  const model = buildStarModel({
    planets: [{ id: 'known-phase', kMps: 1, periodDays: eph.periodDays, tcBjdTdb: eph.tcBjdTdb, periodErrDays: 0, tcErrDays: 0, ecc: 0, omegaDeg: 90 }],
    nightlyJitterMps: 0,
    spanBjdTdb: span,
  });
  const variance = kVariances(
    model,
    informationVisits(
      model,
      timesBjdTdb.map((bjd, n) => ({ bjdTdb: bjd, whiteSigmaMps: rvErrorsMps[n]!, night: n, nightBjdTdb: bjd })),
    ),
  )[0]!;
  return Math.sqrt(variance);
}

function checkInput(input: KnownPhaseInput): void {
  if (input.timesBjdTdb.length !== input.rvErrorsMps.length) throw new RangeError('times and sigma differ in length');
  if (!input.periodsDays.length || !input.msinisEarth.length) throw new RangeError('need at least one period and one mass');
}

/** K of a circular orbit, m/s. */
const kOf = (input: KnownPhaseInput, periodDays: number, planetMassEarth: number) =>
  semiAmplitudeMps({ starMassSun: input.starMassSun, planetMassEarth, periodDays });

/** The analytic map: P = Φ(K/σ_K − n) per cell (docs/references.md [Detection-probability], src/rv/detect.ts). */
export function knownPhaseMapAnalytic(input: KnownPhaseInput): KnownPhaseMap {
  checkInput(input);
  const sigmaKMps = input.periodsDays.map((p) => expectedSigmaKMps(input.timesBjdTdb, input.rvErrorsMps, atPeriod(input.ephemeris, p)));
  const detection = input.periodsDays.map((p, i) =>
    input.msinisEarth.map((m) =>
      Number.isFinite(sigmaKMps[i]!) ? detectionProbabilityKnownPhase(kOf(input, p, m), sigmaKMps[i]!, input.goalSignificance) : 0,
    ),
  );
  return { periodsDays: input.periodsDays, msinisEarth: input.msinisEarth, goalSignificance: input.goalSignificance, detection, sigmaKMps };
}

/**
 * The simulated map. Each trial draws the true transit time and period from the ephemeris errors
 * (Tc + δT, P + δP, δ normal), makes v_i = K s_true,i + σ_i ε_i at the visit times, fits K by weighted
 * least squares with a free offset on the predicted signal s_i = −sin(2π φ_i):
 *   K̂ = Σ w (s − s̄)(v − v̄) / Σ w (s − s̄)²,  σ_K = 1 / √(Σ w (s − s̄)²)   (weighted means s̄, v̄;
 * docs/references.md [Visits-needed], weighted form), and counts a detection when K̂/σ_K > n.
 * One seeded stream per cell (deriveSeed), as in the injection map.
 */
export function knownPhaseMapSimulated(input: KnownPhaseInput & { trialsPerCell: number; seed: number }): KnownPhaseMap {
  checkInput(input);
  const { timesBjdTdb, rvErrorsMps, ephemeris: eph, msinisEarth, trialsPerCell } = input;
  const count = timesBjdTdb.length;
  const w = rvErrorsMps.map((s) => 1 / (s * s));
  const sumW = w.reduce((a, b) => a + b, 0);
  const truth = new Float64Array(count);
  const sigmaKMps: number[] = [];
  const detection = input.periodsDays.map((periodDays, i) => {
    const predicted = timesBjdTdb.map((t) => -Math.sin(2 * Math.PI * phaseAt(atPeriod(eph, periodDays), t)));
    const meanS = predicted.reduce((a, s, n) => a + w[n]! * s, 0) / sumW;
    const centred = predicted.map((s) => s - meanS);
    const info = centred.reduce((a, c, n) => a + w[n]! * c * c, 0);
    const sigmaK = info > 0 ? 1 / Math.sqrt(info) : Infinity;
    sigmaKMps.push(sigmaK);
    return msinisEarth.map((m, j) => {
      if (!Number.isFinite(sigmaK)) return 0;
      const kMps = kOf(input, periodDays, m);
      const rng = createRng(deriveSeed(input.seed, i * msinisEarth.length + j));
      let detected = 0;
      for (let trial = 0; trial < trialsPerCell; trial++) {
        const trueEph = { ...eph, periodDays: periodDays + eph.periodErrDays * rng.normal(), tcBjdTdb: eph.tcBjdTdb + eph.tcErrDays * rng.normal() };
        for (let n = 0; n < count; n++) truth[n] = -kMps * Math.sin(2 * Math.PI * phaseAt(trueEph, timesBjdTdb[n]!)) + rvErrorsMps[n]! * rng.normal();
        // Σ w (s − s̄)(v − v̄) = Σ w (s − s̄) v, since Σ w (s − s̄) = 0.
        let cross = 0;
        for (let n = 0; n < count; n++) cross += w[n]! * centred[n]! * truth[n]!;
        if (cross / info / sigmaK > input.goalSignificance) detected++;
      }
      return detected / trialsPerCell;
    });
  });
  return { periodsDays: input.periodsDays, msinisEarth, goalSignificance: input.goalSignificance, detection, sigmaKMps };
}

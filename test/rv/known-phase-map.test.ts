// Known-phase detection maps: the analytic Φ(K/σ_K − n) against simulated least-squares fits, and
// the expected σ_K against a direct least-squares computation.
import { describe, expect, it } from 'vitest';
import type { Ephemeris } from '../../src/model.js';
import { semiAmplitudeMps } from '../../src/orbit/semi-amplitude.js';
import { logSpaced } from '../../src/rv/injection-map.js';
import { expectedSigmaKMps, knownPhaseMapAnalytic, knownPhaseMapSimulated, type KnownPhaseInput } from '../../src/rv/known-phase-map.js';
import { createRng } from '../../src/rv/random.js';

// An invented transiting planet and 12 visits on random nights of a 70-day window, 120 days after
// its reference transit; σ_eff 2 to 3.5 m/s.
const EPH: Ephemeris = { periodDays: 4.7731, periodErrDays: 0.0004, tcBjdTdb: 2_461_180.3342, tcErrDays: 0.0015 };

function visits(): Pick<KnownPhaseInput, 'timesBjdTdb' | 'rvErrorsMps'> {
  const rng = createRng(8);
  const nights = new Set<number>();
  while (nights.size < 12) nights.add(Math.floor(70 * rng.uniform()));
  const timesBjdTdb = [...nights].sort((a, b) => a - b).map((n) => 2_461_300.55 + n + 0.25 * rng.uniform());
  return { timesBjdTdb, rvErrorsMps: timesBjdTdb.map(() => 2 + 1.5 * rng.uniform()) };
}

const input: KnownPhaseInput = {
  ...visits(),
  ephemeris: EPH,
  periodsDays: logSpaced(EPH.periodDays / 1.6, EPH.periodDays * 1.6, 6),
  msinisEarth: logSpaced(4, 40, 7),
  starMassSun: 0.82,
  goalSignificance: 4,
};

describe('known-phase detection map', () => {
  it('analytic Φ(K/σ_K − n) agrees with simulated fits within 3 percentage points in every cell', () => {
    // 5,000 trials a cell: the binomial standard error is at most 0.7 points, so 3 points is > 4 σ.
    const analytic = knownPhaseMapAnalytic(input);
    const simulated = knownPhaseMapSimulated({ ...input, trialsPerCell: 5000, seed: 17 });
    const cells = analytic.detection.flatMap((row, i) => row.map((p, j) => [p, simulated.detection[i]![j]!] as const));
    for (const [a, s] of cells) expect(Math.abs(a - s)).toBeLessThanOrEqual(0.03);
    // The grid spans the transition, so the comparison is not between zeros and ones only.
    expect(cells.filter(([a]) => a > 0.1 && a < 0.9).length).toBeGreaterThanOrEqual(8);
  });

  it('rises with mass at fixed period (analytic exactly, simulated within sampling error)', () => {
    const analytic = knownPhaseMapAnalytic(input);
    const simulated = knownPhaseMapSimulated({ ...input, trialsPerCell: 400, seed: 3 });
    for (const row of analytic.detection) for (let j = 1; j < row.length; j++) expect(row[j]!).toBeGreaterThanOrEqual(row[j - 1]!);
    // Two binomial standard errors of a difference at p = 0.5 with 400 trials: 2 · √2 · 0.025 ≈ 0.071.
    for (const row of simulated.detection) for (let j = 1; j < row.length; j++) expect(row[j]!).toBeGreaterThanOrEqual(row[j - 1]! - 0.071);
  });

  it('expected σ_K equals the direct least-squares σ_K on the predicted phases, whatever the catalogue errors', () => {
    const exact = { ...EPH, periodErrDays: 0, tcErrDays: 0 };
    // Direct reference: σ_K = 1/√(Σ w (s − s̄)²), s = −sin 2π(t − Tc)/P, weighted mean s̄ (docs/references.md [Visits-needed]).
    const { timesBjdTdb, rvErrorsMps } = input;
    const w = rvErrorsMps.map((s) => 1 / (s * s));
    const s = timesBjdTdb.map((t) => -Math.sin((2 * Math.PI * (t - EPH.tcBjdTdb)) / EPH.periodDays));
    const mean = s.reduce((a, v, n) => a + w[n]! * v, 0) / w.reduce((a, b) => a + b, 0);
    const reference = 1 / Math.sqrt(s.reduce((a, v, n) => a + w[n]! * (v - mean) ** 2, 0));
    expect(expectedSigmaKMps(timesBjdTdb, rvErrorsMps, exact)).toBeCloseTo(reference, 9);
    // A known-phase fit does not fit Tc or P, so their catalogue errors do not enter its σ_K.
    expect(expectedSigmaKMps(timesBjdTdb, rvErrorsMps, { ...EPH, tcErrDays: 10 * EPH.periodDays })).toBeCloseTo(reference, 9);
  });

  it('at 50% detection K/σ_K equals n (Φ(0) = 1/2)', () => {
    // One cell at the ephemeris period, the mass whose K is exactly n σ_K.
    const sigmaK = expectedSigmaKMps(input.timesBjdTdb, input.rvErrorsMps, EPH);
    const kOf = (m: number) => semiAmplitudeMps({ starMassSun: input.starMassSun, planetMassEarth: m, periodDays: EPH.periodDays });
    let lo = 0.1,
      hi = 1000;
    for (let k = 0; k < 100; k++) {
      const mid = Math.sqrt(lo * hi);
      if (kOf(mid) < input.goalSignificance * sigmaK) lo = mid;
      else hi = mid;
    }
    const map = knownPhaseMapAnalytic({ ...input, periodsDays: [EPH.periodDays], msinisEarth: [lo] });
    expect(map.detection[0]![0]).toBeCloseTo(0.5, 6);
  });
});

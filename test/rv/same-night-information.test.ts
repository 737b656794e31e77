// A second visit in one night adds information on K (it averages the white part: photon, floor,
// white jitter) but less than the same visit on a new night, whose per-night jitter is a fresh
// draw. Checked against a dense generalised-least-squares computation written here: model
// v = γ + K s(t) with s(t) = sin(2π (t − Tc)/P) (exact ephemeris, so γ and K are the only
// parameters), covariance C = diag(σ_white²) + σ_night² on every pair of one night, and
// Var(K) = [(Xᵀ C⁻¹ X)⁻¹]_KK (common practice).
import { describe, expect, it } from 'vitest';
import { buildStarModel } from '../../src/rv/information-model.js';
import { informationVisits, kVariances } from '../../src/rv/information.js';

const P = 3;
const TC = 0.2;
const SIGMA_WHITE = 2;
const SIGMA_NIGHT = 1.5;

interface Visit {
  bjdTdb: number;
  night: number;
}

/** Solves A x = b by Gauss-Jordan elimination with partial pivoting (small dense systems). */
function solve(a: number[][], b: number[][]): number[][] {
  const n = a.length;
  const m = a.map((row, i) => [...row, ...b[i]!]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(m[r]![col]!) > Math.abs(m[pivot]![col]!)) pivot = r;
    [m[col], m[pivot]] = [m[pivot]!, m[col]!];
    const p = m[col]![col]!;
    for (let c = 0; c < m[col]!.length; c++) m[col]![c]! /= p;
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const f = m[r]![col]!;
      for (let c = 0; c < m[r]!.length; c++) m[r]![c]! -= f * m[col]![c]!;
    }
  }
  return m.map((row) => row.slice(n));
}

/** σ_K by dense GLS. */
function denseSigmaK(visits: Visit[]): number {
  const cov = visits.map((a, i) => visits.map((b, k) => (i === k ? SIGMA_WHITE ** 2 : 0) + (a.night === b.night ? SIGMA_NIGHT ** 2 : 0)));
  const x = visits.map((v) => [1, Math.sin((2 * Math.PI * (v.bjdTdb - TC)) / P)]);
  const cInvX = solve(cov, x);
  const fisher = [0, 1].map((r) => [0, 1].map((c) => x.reduce((sum, row, i) => sum + row[r]! * cInvX[i]![c]!, 0)));
  const inverse = solve(fisher, [
    [1, 0],
    [0, 1],
  ]);
  return Math.sqrt(inverse[1]![1]!);
}

function modelSigmaK(visits: Visit[]): number {
  const model = buildStarModel({
    planets: [{ id: 'b', kMps: 3, periodDays: P, tcBjdTdb: TC, periodErrDays: 0, tcErrDays: 0, ecc: 0, omegaDeg: 90 }],
    nightlyJitterMps: SIGMA_NIGHT,
    spanBjdTdb: [0, 30],
  });
  const input = visits.map((v) => ({ bjdTdb: v.bjdTdb, whiteSigmaMps: SIGMA_WHITE, night: v.night, nightBjdTdb: v.night + 0.5 }));
  return Math.sqrt(kVariances(model, informationVisits(model, input))[0]!);
}

describe('several visits in one night', () => {
  // Six nights, one visit each, at assorted phases; then one more visit 2 h after the first
  // night's, or the same phase three orbits later on a night of its own.
  const base: Visit[] = [0.1, 1.3, 2.2, 4.05, 5.4, 7.15].map((bjd) => ({ bjdTdb: bjd, night: Math.floor(bjd) }));
  const later = base[0]!.bjdTdb + 2 / 24;
  const sameNight = [...base, { bjdTdb: later, night: base[0]!.night }];
  const newNight = [...base, { bjdTdb: later + 3 * P, night: Math.floor(later + 3 * P) }];

  it('the information model gives the dense GLS sigma_K for visits sharing nights', () => {
    for (const visits of [base, sameNight, newNight]) expect(modelSigmaK(visits)).toBeCloseTo(denseSigmaK(visits), 10);
  });

  it('a second visit in a night helps, a visit on a new night at the same phase helps more', () => {
    const [b, same, fresh] = [base, sameNight, newNight].map(denseSigmaK) as [number, number, number];
    expect(same).toBeLessThan(b);
    expect(fresh).toBeLessThan(same);
    // The same comparisons from the model the planner uses.
    expect(modelSigmaK(sameNight)).toBeLessThan(modelSigmaK(base));
    expect(modelSigmaK(newNight)).toBeLessThan(modelSigmaK(sameNight));
  });
});

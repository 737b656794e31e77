// K/sigma_K recomputed from plan.csv alone, written here from the formula (not with the scheduler's
// functions), with a tolerance that follows from the CSV's rounding.
//
// Least squares for v_i = gamma + K s_i with weights w_i = 1/sigma_eff,i^2 and gamma free gives
// Var(K^) = 1/I, I = sum w_i (s_i - sbar_w)^2 (weighted linear regression, common practice;
// docs/references.md [Visits-needed]). With s_i = -sin(2 pi phi_i) and a Gaussian phase error sigma_i
// (cycles), independent between visits, the expectation of I over the phase errors is
//   E[I] = sum w E[s^2] - E[(sum w s)^2] / W,  W = sum w,
//   E[(sum w s)^2] = sum_{i != j} w_i w_j m_i m_j + sum_i w_i^2 q_i,
// with m = E[s] = -sin(2 pi phi) exp(-2 pi^2 sigma^2) and q = E[s^2] = (1 - cos(4 pi phi) exp(-8 pi^2 sigma^2)) / 2
// (E[cos(a eps)] = exp(-a^2 sigma^2 / 2) for eps ~ N(0, sigma^2), the normal characteristic
// function; the form in the comment of src/schedule/objective-ephemeris.ts). Here the cross term is
// summed pair by pair. sigma_K = 1/sqrt(E[I]).
//
// For an eccentric planet s is the Keplerian RV curve with K = 1 (src/orbit/rv-curve.ts, periastron
// placed by the transit time), and m, q are its mean and mean square over the Gaussian phase error
// by the trapezoid rule over +-7 sigma: a slow, direct average, not the scheduler's series.
import { parse } from 'csv-parse/sync';
import { periastronFromConjunctionBjd } from '../../src/orbit/periastron-time.js';
import { radialVelocityMps } from '../../src/orbit/rv-curve.js';
import { gaussianMean } from '../support/gaussian-mean.js';

/** s(phi) of an eccentric planet, phase from mid-transit; undefined for a circular orbit. */
export function orbitSignal(planet: { ecc: number; omegaDeg: number } | undefined): ((phase: number) => number) | undefined {
  if (!planet || planet.ecc === 0) return undefined;
  const orbit = { kMps: 1, periodDays: 1, ecc: planet.ecc, omegaDeg: planet.omegaDeg, periastronBjd: periastronFromConjunctionBjd({ tcBjd: 0, periodDays: 1, ...planet }) };
  return (phase) => radialVelocityMps(orbit, phase);
}


export interface CsvVisit {
  targetId: string;
  startUtc: string;
  midBjdTdb: number;
  phase: number;
  phaseErr: number;
  sigmaEffMps: number;
}

/** Half a unit in the last place written by src/report/plan-csv.ts for each column used. */
export const CSV_HALF_UNIT = { phase: 0.5e-5, phaseErr: 0.5e-5, sigmaEffMps: 0.5e-4 } as const;

export function parsePlanCsv(text: string): { header: string[]; rows: Record<string, string>[] } {
  const records = parse(text, { skip_empty_lines: true }) as string[][];
  const [header, ...body] = records;
  return { header: header!, rows: body.map((cells) => Object.fromEntries(header!.map((h, i) => [h, cells[i] ?? '']))) };
}

/** The ephemeris visits of plan.csv (rows with a phase). */
export function ephemerisVisits(rows: Record<string, string>[]): CsvVisit[] {
  return rows
    .filter((r) => r.phase !== '')
    .map((r) => ({
      targetId: r.targetId!,
      startUtc: r.startUtc!,
      midBjdTdb: Number(r.midBjdTdb),
      phase: Number(r.phase),
      phaseErr: Number(r.phaseErr),
      sigmaEffMps: Number(r.sigmaEffMps),
    }));
}

/** E[I] of a target's visits (1/(m/s)^2), by the pairwise form above. */
export function expectedInformation(visits: Pick<CsvVisit, 'phase' | 'phaseErr' | 'sigmaEffMps'>[], signal?: (phase: number) => number): number {
  const w = visits.map((v) => 1 / (v.sigmaEffMps * v.sigmaEffMps));
  const m = visits.map((v) =>
    signal ? gaussianMean(signal, v.phase, v.phaseErr) : -Math.sin(2 * Math.PI * v.phase) * Math.exp(-2 * Math.PI ** 2 * v.phaseErr ** 2),
  );
  const q = visits.map((v) =>
    signal ? gaussianMean((p) => signal(p) ** 2, v.phase, v.phaseErr) : 0.5 - 0.5 * Math.cos(4 * Math.PI * v.phase) * Math.exp(-8 * Math.PI ** 2 * v.phaseErr ** 2),
  );
  const total = w.reduce((a, b) => a + b, 0);
  if (total === 0) return 0;
  let squareOfSum = 0;
  for (let i = 0; i < visits.length; i++) {
    squareOfSum += w[i]! * w[i]! * q[i]!;
    for (let j = 0; j < visits.length; j++) if (j !== i) squareOfSum += w[i]! * w[j]! * m[i]! * m[j]!;
  }
  const meanSquare = w.reduce((sum, wi, i) => sum + wi * q[i]!, 0);
  const information = meanSquare - squareOfSum / total;
  // One visit (or visits at one phase) carry no information on K; the subtraction leaves a residue
  // of the order of the rounding of its terms (1e-16 relative), clamped to zero.
  return information > 1e-12 * meanSquare ? information : 0;
}

/**
 * K/sigma_K = K sqrt(E[I]) from the CSV rows, and the first-order bound on how far the CSV's
 * rounding can move it: sum over every value of |d(K/sigma_K)/dx| times half its last unit
 * (derivatives by central differences of that step).
 */
export function kOverSigmaKFromCsv(kMps: number, visits: CsvVisit[], signal?: (phase: number) => number): { value: number; roundingBound: number } {
  const ratio = (vs: CsvVisit[]) => kMps * Math.sqrt(expectedInformation(vs, signal));
  const value = ratio(visits);
  let roundingBound = 0;
  visits.forEach((_, i) => {
    for (const field of ['phase', 'phaseErr', 'sigmaEffMps'] as const) {
      const h = CSV_HALF_UNIT[field];
      const shifted = (d: number) => ratio(visits.map((v, k) => (k === i ? { ...v, [field]: Math.max(0, v[field] + d) } : v)));
      roundingBound += Math.abs(shifted(h) - shifted(-h)) / 2;
    }
  });
  return { value, roundingBound };
}

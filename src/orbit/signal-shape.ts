// The shape of a planet's RV signal against orbital phase, and its expected moments under a
// Gaussian phase error: what the scheduler and the report need to weigh a visit of an
// eccentric orbit.
import { eccentricAnomalyRad } from './kepler-equation.js';
import { trueAnomalyRad } from './anomalies.js';
import { periastronFromConjunctionBjd } from './periastron-time.js';
import { GH_W, GH_X } from '../rv/gauss-hermite.js';

export interface SignalShape {
  ecc: number;
  omegaDeg: number;
  /** s(φ) with v = γ + K s, φ in cycles from mid-transit. */
  at(phase: number): number;
  /** E[s] and E[s²] when the true phase is φ + ε, ε ~ N(0, σ²) in cycles. */
  moments(phase: number, phaseErr: number): { m: number; q: number };
}

/** The shape of a target's planet: its eccentric orbit if it has one, else the circular −sin 2πφ. */
export function planetSignalShape(planet: { ecc: number; omegaDeg: number } | undefined): SignalShape {
  return signalShape(planet?.ecc ?? 0, planet?.omegaDeg ?? 90);
}

/** Samples per cycle for the Fourier series of s and s² (enough for e ≤ 0.9 at the 1e-3 level). */
const SAMPLES = 512;
/** Below this phase error the moments are taken by Gauss–Hermite quadrature of s itself. */
const QUADRATURE_BELOW = 0.02;

// Gauss–Hermite nodes and weights (src/rv/gauss-hermite.ts): with x = ε/(σ√2),
// E[f(φ+ε)] = Σ w_k f(φ + σ√2 x_k) / √π.

/**
 * The signal of a Keplerian orbit: v = γ + K [cos(ν + ω) + e cos ω] (REFERENCES.md, "Keplerian
 * RV"), with the mean anomaly M = 2π(φ − φ_p) counted from the periastron phase φ_p that puts the
 * transit at φ = 0 (periastronFromConjunctionBjd). For e = 0 and ω = 90° this is s = −sin 2πφ.
 */
export function signalShape(ecc: number, omegaDeg: number): SignalShape {
  const omega = (omegaDeg * Math.PI) / 180;
  const periastronPhase = periastronFromConjunctionBjd({ tcBjd: 0, periodDays: 1, ecc, omegaDeg });
  const at = (phase: number): number => {
    const nu = trueAnomalyRad(eccentricAnomalyRad(2 * Math.PI * (phase - periastronPhase), ecc), ecc);
    return Math.cos(nu + omega) + ecc * Math.cos(omega);
  };
  const s = fourier((k) => at(k / SAMPLES));
  const s2 = fourier((k) => at(k / SAMPLES) ** 2);
  const moments = (phase: number, phaseErr: number) => {
    if (phaseErr < QUADRATURE_BELOW) {
      let m = 0;
      let q = 0;
      for (let k = 0; k < GH_X.length; k++) {
        for (const sign of [1, -1]) {
          const v = at(phase + sign * phaseErr * Math.SQRT2 * GH_X[k]!);
          m += GH_W[k]! * v;
          q += GH_W[k]! * v * v;
        }
      }
      return { m: m / Math.sqrt(Math.PI), q: q / Math.sqrt(Math.PI) };
    }
    return { m: damped(s, phase, phaseErr), q: damped(s2, phase, phaseErr) };
  };
  return { ecc, omegaDeg, at, moments };
}

interface Series {
  a0: number;
  cos: Float64Array;
  sin: Float64Array;
}

/** Fourier coefficients of a function sampled at SAMPLES phases (the discrete Fourier transform). */
function fourier(sample: (k: number) => number): Series {
  const values = Float64Array.from({ length: SAMPLES }, (_, k) => sample(k));
  const half = SAMPLES / 2;
  const cos = new Float64Array(half);
  const sin = new Float64Array(half);
  for (let n = 1; n < half; n++) {
    let a = 0;
    let b = 0;
    for (let k = 0; k < SAMPLES; k++) {
      const angle = (2 * Math.PI * n * k) / SAMPLES;
      a += values[k]! * Math.cos(angle);
      b += values[k]! * Math.sin(angle);
    }
    cos[n] = (2 * a) / SAMPLES;
    sin[n] = (2 * b) / SAMPLES;
  }
  return { a0: values.reduce((sum, v) => sum + v, 0) / SAMPLES, cos, sin };
}

/**
 * E[f(φ + ε)] for ε ~ N(0, σ²): each harmonic n is damped by exp(−2π² n² σ²), the normal
 * characteristic function at 2πn (common practice). Harmonics are summed until the damping
 * falls below 1e-12.
 */
function damped(series: Series, phase: number, phaseErr: number): number {
  let total = series.a0;
  for (let n = 1; n < series.cos.length; n++) {
    const damping = Math.exp(-2 * Math.PI * Math.PI * n * n * phaseErr * phaseErr);
    if (damping < 1e-12) break;
    const angle = 2 * Math.PI * n * phase;
    total += damping * (series.cos[n]! * Math.cos(angle) + series.sin[n]! * Math.sin(angle));
  }
  return total;
}

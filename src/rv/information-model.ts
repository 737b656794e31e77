// The linearised RV model of one star, for its information (Fisher) matrix
// (docs/references.md [Fisher-RV]): the parameters, their Gaussian priors from the target list,
// the Jacobian of v(t) = γ + Σ_planets K s(t) at the nominal parameters, and the sample
// ephemerides over which the expected K variance is averaged ([Ford2008]: the design is judged by
// the posterior it is expected to give, over what is still unknown about the orbit).
//
// Parameters, in this order (the K's last, so their variances come from the trailing block of
// the Cholesky factor):
//   γ;
//   per planet: α = δTc_ref / P (cycles) when Tc or P is uncertain, β = δP U / P (cycles of phase
//   drift at the span's edge) when P is uncertain, and e cos ω, e sin ω when the eccentricity is
//   fitted;
//   per planet: K (m/s).
// Tc_ref is the predicted transit nearest the middle of the span and U the largest number of
// orbits between it and the span's ends, so α and β are phase shifts of order their errors and
// nearly uncorrelated: the matrix stays well conditioned even for a period measured years ago.
// The eccentricity is fitted as (e cos ω, e sin ω), not (√e cos ω, √e sin ω): the latter has a
// zero Jacobian at e = 0, so a linearised bound would charge nothing for fitting e of a circular
// orbit, while the former keeps the cost of the second harmonic ([Lucy-Sweeney1971] on the bias
// of e near zero is why the prior matters there).
import { signalShape, type SignalShape } from '../orbit/signal-shape.js';

export interface PlanetInput {
  id: string;
  kMps: number;
  periodDays: number;
  /** Mid-transit (conjunction) time, BJD_TDB. */
  tcBjdTdb: number;
  periodErrDays: number;
  tcErrDays: number;
  ecc: number;
  omegaDeg: number;
  /** When given (> 0): e cos ω and e sin ω are fitted, each with this Gaussian prior width. */
  eccPriorSigma?: number;
}

/** Quasi-periodic stellar activity (activity-kernel.ts). */
export interface ActivityInput {
  amplitudeMps: number;
  rotationDays: number;
  coherenceDays: number;
}

export interface StarInput {
  planets: PlanetInput[];
  /** Jitter shared by every visit of one night (m/s); the white part belongs to each visit's σ. */
  nightlyJitterMps: number;
  /** Correlated activity across nights; constant within a night. */
  activity?: ActivityInput;
  /** First and last time (BJD_TDB) the visits may fall at: sets reference epochs and samples. */
  spanBjdTdb: [number, number];
}

interface PlanetLayout {
  input: PlanetInput;
  tcRefBjdTdb: number;
  /** Orbits from Tc_ref to the farther end of the span (at least 1). */
  orbitsScale: number;
  alpha: number;
  beta: number;
  ecc: number;
  k: number;
  shape: SignalShape;
  omegaRad: number;
}

/** One sample ephemeris: per planet the shifts (α, β) in cycles, and the sample's weight. */
export interface EphemerisSample {
  weight: number;
  alpha: Float64Array;
  beta: Float64Array;
}

export interface StarModel {
  input: StarInput;
  paramCount: number;
  planetCount: number;
  /** Index of planet i's K among the parameters (the last planetCount). */
  kIndex: number[];
  /** Prior precision, packed lower triangle (row-major: (0,0), (1,0), (1,1), ...). */
  priorPrecision: Float64Array;
  samples: EphemerisSample[];
  planets: PlanetLayout[];
}

/**
 * A phase error (cycles) below which an ephemeris dimension is not sampled:
 * over ±σ the design rows move by 2πσ, so F changes by about (2πσ)² < 0.4%.
 */
export const SAMPLE_BELOW_CYCLES = 0.01;
/** A period error with an exactly known Tc is given this floor on Tc (days), so the prior stays invertible. */
const TC_ERR_FLOOR_DAYS = 1e-6;
/** Step of the central differences in (e cos ω, e sin ω). */
const ECC_STEP = 1e-4;

export const packedIndex = (row: number, col: number): number => (row >= col ? (row * (row + 1)) / 2 + col : (col * (col + 1)) / 2 + row);
export const packedLength = (p: number): number => (p * (p + 1)) / 2;

function fail(message: string): never {
  throw new Error(`information model: ${message}`);
}

/** Covariance of (α, β) from the catalogue errors: Tc_ref = Tc + n P (docs/references.md [Ephemeris-propagation]). */
function shiftCovariance(planet: PlanetInput, epochs: number, orbitsScale: number): { aa: number; ab: number; bb: number } {
  const sp = planet.periodErrDays;
  const st = sp > 0 ? Math.max(planet.tcErrDays, TC_ERR_FLOOR_DAYS) : planet.tcErrDays;
  const p2 = planet.periodDays * planet.periodDays;
  return {
    aa: (st * st + epochs * epochs * sp * sp) / p2,
    ab: (epochs * sp * sp * orbitsScale) / p2,
    bb: (sp * sp * orbitsScale * orbitsScale) / p2,
  };
}

/**
 * Sigma points of a d-dimensional standard normal (Julier & Uhlmann 1997, [Unscented]): the
 * centre with weight κ/(d + κ) and ±√(d + κ) along each axis with 1/(2(d + κ)) each; κ = 2 for
 * d = 1 (the three-point Gauss–Hermite rule), else κ = 1. Exact for moments up to degree 3.
 */
function sigmaPoints(d: number): { weight: number; z: Float64Array }[] {
  if (d === 0) return [{ weight: 1, z: new Float64Array(0) }];
  const kappa = d === 1 ? 2 : 1;
  const spread = Math.sqrt(d + kappa);
  const points = [{ weight: kappa / (d + kappa), z: new Float64Array(d) }];
  for (let i = 0; i < d; i++) {
    for (const sign of [1, -1]) {
      const z = new Float64Array(d);
      z[i] = sign * spread;
      points.push({ weight: 1 / (2 * (d + kappa)), z });
    }
  }
  return points;
}

/** Builds the model of one star; throws a plain Error for values the caller should never pass. */
export function buildStarModel(input: StarInput): StarModel {
  const [start, end] = input.spanBjdTdb;
  if (!(end >= start)) fail('span end before start');
  if (!(input.nightlyJitterMps >= 0)) fail('nightly jitter must be >= 0');
  const mid = (start + end) / 2;
  let p = 1;
  const layouts: PlanetLayout[] = input.planets.map((planet) => {
    if (!(planet.kMps > 0 && planet.periodDays > 0 && planet.ecc >= 0 && planet.ecc < 1)) fail(`planet ${planet.id} needs K > 0, P > 0, 0 <= e < 1`);
    const epochs = Math.round((mid - planet.tcBjdTdb) / planet.periodDays);
    const tcRefBjdTdb = planet.tcBjdTdb + epochs * planet.periodDays;
    const orbitsScale = Math.max(1, Math.abs(start - tcRefBjdTdb) / planet.periodDays, Math.abs(end - tcRefBjdTdb) / planet.periodDays);
    const layout: PlanetLayout = {
      input: planet,
      tcRefBjdTdb,
      orbitsScale,
      alpha: -1,
      beta: -1,
      ecc: -1,
      k: -1,
      shape: signalShape(planet.ecc, planet.omegaDeg),
      omegaRad: (planet.omegaDeg * Math.PI) / 180,
    };
    if (planet.tcErrDays > 0 || planet.periodErrDays > 0) layout.alpha = p++;
    if (planet.periodErrDays > 0) layout.beta = p++;
    if ((planet.eccPriorSigma ?? 0) > 0) {
      layout.ecc = p;
      p += 2;
    }
    return layout;
  });
  for (const layout of layouts) layout.k = p++;

  const prior = new Float64Array(packedLength(p));
  const dims: { planet: number; alpha: number; beta: number }[] = [];
  layouts.forEach((layout, i) => {
    const planet = layout.input;
    if (layout.alpha >= 0) {
      const epochs = Math.round((layout.tcRefBjdTdb - planet.tcBjdTdb) / planet.periodDays);
      const cov = shiftCovariance(planet, epochs, layout.orbitsScale);
      if (layout.beta < 0) {
        prior[packedIndex(layout.alpha, layout.alpha)] = 1 / cov.aa;
        if (Math.sqrt(cov.aa) > SAMPLE_BELOW_CYCLES) dims.push({ planet: i, alpha: Math.sqrt(cov.aa), beta: 0 });
      } else {
        // Inverse of the 2x2 covariance, and its Cholesky factor's columns as sample directions.
        const det = cov.aa * cov.bb - cov.ab * cov.ab;
        prior[packedIndex(layout.alpha, layout.alpha)] = cov.bb / det;
        prior[packedIndex(layout.beta, layout.alpha)] = -cov.ab / det;
        prior[packedIndex(layout.beta, layout.beta)] = cov.aa / det;
        const l11 = Math.sqrt(cov.aa);
        const l21 = cov.ab / l11;
        const l22 = Math.sqrt(Math.max(0, cov.bb - l21 * l21));
        if (l11 + Math.abs(l21) > SAMPLE_BELOW_CYCLES) dims.push({ planet: i, alpha: l11, beta: l21 });
        if (l22 > SAMPLE_BELOW_CYCLES) dims.push({ planet: i, alpha: 0, beta: l22 });
      }
    }
    if (layout.ecc >= 0) {
      const precision = 1 / planet.eccPriorSigma! ** 2;
      prior[packedIndex(layout.ecc, layout.ecc)] = precision;
      prior[packedIndex(layout.ecc + 1, layout.ecc + 1)] = precision;
    }
  });
  const samples = sigmaPoints(dims.length).map(({ weight, z }) => {
    const alpha = new Float64Array(layouts.length);
    const beta = new Float64Array(layouts.length);
    dims.forEach((dim, d) => {
      alpha[dim.planet] += dim.alpha * z[d]!;
      beta[dim.planet] += dim.beta * z[d]!;
    });
    return { weight, alpha, beta };
  });
  return { input, paramCount: p, planetCount: layouts.length, kIndex: layouts.map((l) => l.k), priorPrecision: prior, samples, planets: layouts };
}

/** s(φ) at (e cos ω, e sin ω) = (x, y), the transit held at φ = 0. */
function signalAtEccVector(phase: number, x: number, y: number): number {
  const ecc = Math.hypot(x, y);
  return signalShape(ecc, ecc > 0 ? (Math.atan2(y, x) * 180) / Math.PI : 90).at(phase);
}

/**
 * The Jacobian row ∂v/∂θ at time t (BJD_TDB) for sample s, written to out[offset .. offset + p).
 * The sample's ephemeris is the nominal one shifted by its (α, β): Tc_ref' = Tc_ref + α P,
 * P' = P (1 + β / U); the phase is (t − Tc_ref') / P'.
 */
export function designRow(model: StarModel, sample: EphemerisSample, tBjdTdb: number, out: Float64Array, offset: number): void {
  out.fill(0, offset, offset + model.paramCount);
  out[offset] = 1;
  model.planets.forEach((layout, i) => {
    const planet = layout.input;
    const period = planet.periodDays * (1 + sample.beta[i]! / layout.orbitsScale);
    const tcRef = layout.tcRefBjdTdb + sample.alpha[i]! * planet.periodDays;
    const cycles = (tBjdTdb - tcRef) / period;
    const phase = cycles - Math.floor(cycles);
    const k = planet.kMps;
    out[offset + layout.k] = layout.shape.at(phase);
    // ∂φ/∂α = −P/P'; ∂φ/∂β = −(t − Tc_ref') P / (P'² U).
    const slope = layout.alpha >= 0 ? layout.shape.slope(phase) : 0;
    if (layout.alpha >= 0) out[offset + layout.alpha] = -k * slope * (planet.periodDays / period);
    if (layout.beta >= 0) out[offset + layout.beta] = (-k * slope * cycles * planet.periodDays) / (period * layout.orbitsScale);
    if (layout.ecc >= 0) {
      const x = planet.ecc * Math.cos(layout.omegaRad);
      const y = planet.ecc * Math.sin(layout.omegaRad);
      const h = ECC_STEP;
      out[offset + layout.ecc] = (k * (signalAtEccVector(phase, x + h, y) - signalAtEccVector(phase, x - h, y))) / (2 * h);
      out[offset + layout.ecc + 1] = (k * (signalAtEccVector(phase, x, y + h) - signalAtEccVector(phase, x, y - h))) / (2 * h);
    }
  });
}

/** Design rows of one visit for every sample: samples × paramCount values. */
export function designRows(model: StarModel, tBjdTdb: number): Float64Array {
  const p = model.paramCount;
  const out = new Float64Array(model.samples.length * p);
  model.samples.forEach((sample, s) => {
    designRow(model, sample, tBjdTdb, out, s * p);
  });
  return out;
}

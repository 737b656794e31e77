// A Monte Carlo check of K uncertainties, done the way an RV analysis fits a star (common
// practice): simulate velocities from a Keplerian truth plus noise, then fit the full nonlinear
// Keplerian model by Levenberg–Marquardt generalised least squares — the residuals whitened by
// the Cholesky factor of the noise covariance, the catalogue ephemeris (and eccentricity, when
// fitted) entering as Gaussian penalty terms — starting from the catalogue values.
//
// The fit starts from the catalogue and, for a stale ephemeris, from phases a few errors away
// (bestFit below), keeping the best: a local fit from the catalogue alone can settle in a wrong
// minimum a whole fraction of a cycle away. K is kept positive (common practice: K is an amplitude). The curve of (−K, Tc + P/2) is that
// of (K, Tc) for a circular orbit, so with K free the fit may settle on the mirror solution,
// whose "transit" is the occultation: with a loose transit prior that mirror is nearer the
// catalogue than the truth in a few per cent of data sets, and those fits report K ≈ −K_true.
//
// Noise: white per visit (σ_i), a shared offset per night (τ), and quasi-periodic activity
// across nights drawn by Cholesky from src/rv/activity-kernel.ts (constant within a night).
// Truth per data set: Tc and P of each planet drawn from their catalogue Gaussians, K and the
// eccentricity vector at the catalogue values, γ = 0.
import { trueAnomalyRad } from '../../src/orbit/anomalies.js';
import { eccentricAnomalyRad } from '../../src/orbit/kepler-equation.js';
import { periastronFromConjunctionBjdTdb } from '../../src/orbit/periastron-time.js';
import { activityCovariance } from '../../src/rv/activity-kernel.js';
import type { ActivityInput, PlanetInput } from '../../src/rv/information-model.js';
import type { Rng } from '../../src/rv/random.js';

export interface FitVisit {
  bjdTdb: number;
  whiteSigmaMps: number;
  night: number;
  nightBjdTdb: number;
}

export interface FitSetup {
  planets: PlanetInput[];
  nightlyJitterMps: number;
  activity?: ActivityInput;
  visits: FitVisit[];
}

export interface MonteCarloResult {
  /** Per planet: fitted K − true K of every converged data set. */
  kErrors: number[][];
  /** Data sets whose fit did not converge (left out of kErrors). */
  failures: number;
}

/** Cholesky factor (lower, row-major n×n) of a symmetric positive-definite matrix, into `l` when given. */
function cholesky(a: Float64Array, n: number, l: Float64Array = new Float64Array(n * n)): Float64Array {
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i * n + j]!;
      for (let k = 0; k < j; k++) s -= l[i * n + k]! * l[j * n + k]!;
      if (i === j) {
        if (!(s > 0)) throw new Error('fit-rv: matrix not positive definite');
        l[i * n + i] = Math.sqrt(s);
      } else l[i * n + j] = s / l[j * n + j]!;
    }
  }
  return l;
}

/** Solves L x = b in place (L lower, n×n). */
function forward(l: Float64Array, n: number, b: Float64Array, stride = 1, offset = 0): void {
  for (let i = 0; i < n; i++) {
    let s = b[offset + i * stride]!;
    for (let k = 0; k < i; k++) s -= l[i * n + k]! * b[offset + k * stride]!;
    b[offset + i * stride] = s / l[i * n + i]!;
  }
}

/**
 * Solves the symmetric positive-definite system A x = b (p×p) by Cholesky into x, with `l` (p×p)
 * for the factor; false if not positive definite.
 */
function spdSolve(a: Float64Array, b: Float64Array, p: number, x: Float64Array, l: Float64Array): boolean {
  try {
    cholesky(a, p, l);
  } catch {
    return false;
  }
  x.set(b);
  forward(l, p, x);
  for (let i = p - 1; i >= 0; i--) {
    let s = x[i]!;
    for (let k = i + 1; k < p; k++) s -= l[k * p + i]! * x[k]!;
    x[i] = s / l[i * p + i]!;
  }
  return true;
}

interface ParamLayout {
  /** Per planet: index of K, Tc, P and (when fitted) e cos ω (e sin ω next). */
  k: number[];
  tc: number[];
  period: number[];
  ecc: number[];
  count: number;
  /** Prior centre and 1/σ for each parameter (0 when no prior). */
  centre: Float64Array;
  invSigma: Float64Array;
}

function layout(planets: PlanetInput[], origin: number): ParamLayout {
  const lay: ParamLayout = { k: [], tc: [], period: [], ecc: [], count: 1, centre: new Float64Array(0), invSigma: new Float64Array(0) };
  for (const pl of planets) {
    lay.k.push(lay.count++);
    lay.tc.push(lay.count++);
    lay.period.push(lay.count++);
    if ((pl.eccPriorSigma ?? 0) > 0) {
      lay.ecc.push(lay.count);
      lay.count += 2;
    } else lay.ecc.push(-1);
  }
  lay.centre = new Float64Array(lay.count);
  lay.invSigma = new Float64Array(lay.count);
  planets.forEach((pl, i) => {
    lay.centre[lay.k[i]!] = pl.kMps;
    lay.centre[lay.tc[i]!] = pl.tcBjdTdb - origin;
    lay.invSigma[lay.tc[i]!] = 1 / pl.tcErrDays;
    lay.centre[lay.period[i]!] = pl.periodDays;
    lay.invSigma[lay.period[i]!] = 1 / pl.periodErrDays;
    const e = lay.ecc[i]!;
    if (e >= 0) {
      const om = (pl.omegaDeg * Math.PI) / 180;
      lay.centre[e] = pl.ecc * Math.cos(om);
      lay.centre[e + 1] = pl.ecc * Math.sin(om);
      lay.invSigma[e] = 1 / pl.eccPriorSigma!;
      lay.invSigma[e + 1] = 1 / pl.eccPriorSigma!;
    }
  });
  return lay;
}

/** One planet's orbit for a parameter vector, as its velocity curve needs it (times in days from the origin). */
interface Curve {
  kMps: number;
  periodDays: number;
  periastronDays: number;
  ecc: number;
  omegaRad: number;
  /** e cos ω. */
  eccCosOmega: number;
}

/** Planet i's orbit for parameters theta, into `out`. */
function planetCurve(pl: PlanetInput, i: number, lay: ParamLayout, theta: Float64Array, out: Curve): void {
  let ecc = pl.ecc;
  let omegaDeg = pl.omegaDeg;
  const e = lay.ecc[i]!;
  if (e >= 0) {
    ecc = Math.min(Math.hypot(theta[e]!, theta[e + 1]!), 0.95);
    omegaDeg = ecc > 0 ? (Math.atan2(theta[e + 1]!, theta[e]!) * 180) / Math.PI : 90;
  }
  out.kMps = theta[lay.k[i]!]!;
  out.periodDays = theta[lay.period[i]!]!;
  out.periastronDays = periastronFromConjunctionBjdTdb({ tcBjdTdb: theta[lay.tc[i]!]!, periodDays: out.periodDays, ecc, omegaDeg });
  out.ecc = ecc;
  out.omegaRad = (omegaDeg * Math.PI) / 180;
  out.eccCosOmega = ecc * Math.cos(out.omegaRad);
}

const newCurve = (): Curve => ({ kMps: 0, periodDays: 1, periastronDays: 0, ecc: 0, omegaRad: 0, eccCosOmega: 0 });

/**
 * The curve of K = 1 m/s at every time of tRel, into out from `offset`: cos(ν + ω) + e cos ω
 * (docs/references.md [Kepler-RV]), ν from the mean anomaly M = 2π (t − T_p) / P through Kepler's
 * equation, as src/orbit/rv-curve.ts computes it (the same operations in the same order, so the
 * same numbers), with what depends on the orbit alone computed once. For e = 0 Kepler's equation
 * gives E = M, which eccentricAnomalyRad returns unchanged, so it is not called. (ν = M for e = 0
 * would save the true anomaly too, but it is M only to rounding, about 1e-13 rad here, and the
 * fits' results follow such differences to 1e-6 m/s through the accept-or-refuse tests of the
 * Levenberg–Marquardt steps.)
 */
function shapeInto(c: Curve, tRel: Float64Array, out: Float64Array, offset = 0): void {
  for (let i = 0; i < tRel.length; i++) {
    const meanRad = (2 * Math.PI * (tRel[i]! - c.periastronDays)) / c.periodDays;
    const nu = trueAnomalyRad(c.ecc === 0 ? meanRad : eccentricAnomalyRad(meanRad, c.ecc), c.ecc);
    out[offset + i] = Math.cos(nu + c.omegaRad) + c.eccCosOmega;
  }
}

/**
 * Simulates `count` data sets on the visits of `setup` and fits each; returns the K errors.
 * The data sets are drawn one after the other from `rng`.
 */
export function monteCarloKErrors(setup: FitSetup, count: number, rng: Rng, options: { diagnose?: boolean } = {}): MonteCarloResult {
  const diagnostics = { betterFromTruth: 0 };
  const { planets, visits } = setup;
  const n = visits.length;
  const origin = Math.floor(visits[0]!.bjdTdb);
  const tRel = Float64Array.from(visits, (v) => v.bjdTdb - origin);
  const lay = layout(planets, origin);
  const p = lay.count;

  // Noise: the full covariance (for the fit) and the pieces (for the simulation).
  const tau2 = setup.nightlyJitterMps ** 2;
  const cov = new Float64Array(n * n);
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let c = i === j ? visits[i]!.whiteSigmaMps ** 2 : 0;
      if (visits[i]!.night === visits[j]!.night) c += tau2;
      if (setup.activity) c += activityCovariance(setup.activity, visits[i]!.nightBjdTdb - visits[j]!.nightBjdTdb);
      cov[i * n + j] = c;
    }
  const whiten = cholesky(cov, n);
  const nightKeys = [...new Set(visits.map((v) => v.night))];
  const nightOf = visits.map((v) => nightKeys.indexOf(v.night));
  const nightTimes = nightKeys.map((key) => visits.find((v) => v.night === key)!.nightBjdTdb);
  const m = nightKeys.length;
  let activityFactor: Float64Array | null = null;
  if (setup.activity) {
    const k = new Float64Array(m * m);
    for (let a = 0; a < m; a++)
      for (let b = 0; b < m; b++)
        k[a * m + b] = activityCovariance(setup.activity, nightTimes[a]! - nightTimes[b]!) + (a === b ? 1e-9 * setup.activity.amplitudeMps ** 2 : 0);
    activityFactor = cholesky(k, m);
  }

  // Finite-difference steps (central differences) for the nonlinear parameters.
  const step = new Float64Array(p);
  planets.forEach((pl, i) => {
    const orbits = Math.max(1, ...Array.from(tRel, (t) => Math.abs(t - (pl.tcBjdTdb - origin)) / pl.periodDays));
    step[lay.tc[i]!] = 1e-5 * pl.periodDays;
    step[lay.period[i]!] = (1e-5 * pl.periodDays) / orbits;
    if (lay.ecc[i]! >= 0) {
      step[lay.ecc[i]!] = 1e-6;
      step[lay.ecc[i]! + 1] = 1e-6;
    }
  });

  const kErrors: number[][] = planets.map(() => []);
  let failures = 0;
  const y = new Float64Array(n);
  const truth = Float64Array.from(lay.centre);
  const jac = new Float64Array(n * p);
  const resid = new Float64Array(n);
  const a = new Float64Array(p * p);
  const g = new Float64Array(p);
  const nightNoise = new Float64Array(m);
  const actNoise = new Float64Array(m);
  const velocities = new Float64Array(planets.length * n);
  const shapes = new Float64Array(planets.length * n);
  const upShape = new Float64Array(n);
  const downShape = new Float64Array(n);
  const curves = planets.map(newCurve);
  const up = newCurve();
  const down = newCurve();
  // Scratch for the Levenberg–Marquardt steps.
  const damped = new Float64Array(p * p);
  const factor = new Float64Array(p * p);
  const delta = new Float64Array(p);
  const trial = new Float64Array(p);
  const trialResid = new Float64Array(n);
  // The planet each parameter belongs to (γ, index 0, to none).
  const planetOfParam = new Int32Array(p).fill(-1);
  planets.forEach((_, i) => {
    for (const j of [lay.k[i]!, lay.tc[i]!, lay.period[i]!]) planetOfParam[j] = i;
    if (lay.ecc[i]! >= 0) planetOfParam[lay.ecc[i]!] = planetOfParam[lay.ecc[i]! + 1] = i;
  });

  /**
   * Every planet's curve for theta into curves and shapes, its velocities (K times the shape)
   * into velocities.
   */
  const curvesAt = (theta: Float64Array): void => {
    for (let q = 0; q < planets.length; q++) {
      planetCurve(planets[q]!, q, lay, theta, curves[q]!);
      shapeInto(curves[q]!, tRel, shapes, q * n);
      for (let i = 0; i < n; i++) velocities[q * n + i] = curves[q]!.kMps * shapes[q * n + i]!;
    }
  };

  /** The Keplerian model at visit i from velocities: γ plus each planet's velocity, in planet order. */
  const modelVelocity = (gammaMps: number, i: number): number => {
    let v = gammaMps;
    for (let q = 0; q < planets.length; q++) v += velocities[q * n + i]!;
    return v;
  };

  /** Whitened residual vector at theta into out; returns the penalised χ². */
  const chi2 = (theta: Float64Array, out: Float64Array): number => {
    curvesAt(theta);
    for (let i = 0; i < n; i++) out[i] = y[i]! - modelVelocity(theta[0]!, i);
    forward(whiten, n, out);
    let c = 0;
    for (let i = 0; i < n; i++) c += out[i]! * out[i]!;
    for (let j = 0; j < p; j++) c += ((theta[j]! - lay.centre[j]!) * lay.invSigma[j]!) ** 2;
    return c;
  };

  for (let set = 0; set < count; set++) {
    // Truth.
    truth.set(lay.centre);
    truth[0] = 0;
    planets.forEach((pl, i) => {
      truth[lay.tc[i]!] = lay.centre[lay.tc[i]!]! + pl.tcErrDays * rng.normal();
      truth[lay.period[i]!] = pl.periodDays + pl.periodErrDays * rng.normal();
    });
    // Data.
    for (let q = 0; q < m; q++) nightNoise[q] = setup.nightlyJitterMps * rng.normal();
    actNoise.fill(0);
    if (activityFactor) {
      const z = Array.from({ length: m }, () => rng.normal());
      for (let q = 0; q < m; q++) for (let r = 0; r <= q; r++) actNoise[q] += activityFactor[q * m + r]! * z[r]!;
    }
    curvesAt(truth);
    for (let i = 0; i < n; i++)
      y[i] = modelVelocity(truth[0]!, i) + visits[i]!.whiteSigmaMps * rng.normal() + nightNoise[nightOf[i]!]! + actNoise[nightOf[i]!]!;

    const fromCatalogue = Float64Array.from(lay.centre);
    fromCatalogue[0] = y.reduce((s, v) => s + v, 0) / n;
    const fit = bestFit(fromCatalogue);
    if (options.diagnose) {
      const fromTruth = fitFrom(Float64Array.from(truth));
      if (fromTruth.converged && fit.converged && fromTruth.chi2 < fit.chi2 - 1e-6) diagnostics.betterFromTruth++;
    }
    if (!fit.converged) {
      failures++;
      continue;
    }
    planets.forEach((pl, i) => {
      kErrors[i]!.push(fit.theta[lay.k[i]!]! - pl.kMps);
    });
  }
  if (options.diagnose)
    console.log(`fit-rv diagnostics: ${diagnostics.betterFromTruth} of ${count} fits from the catalogue ended above the fit started at the truth`);
  return { kErrors, failures };

  /**
   * A global search over the phase the prior allows, as an analysis would do it: besides the
   * catalogue start, starts with each planet's transit shifted by ±1 and ±2 of its phase error at
   * the middle of the span (when that error exceeds 0.03 cycles); the converged fit of lowest
   * penalised χ² is kept.
   */
  function bestFit(start: Float64Array): { theta: Float64Array; chi2: number; converged: boolean } {
    let best = fitFrom(start);
    const middle = (tRel[0]! + tRel[n - 1]!) / 2;
    planets.forEach((pl, i) => {
      const orbits = (middle - (pl.tcBjdTdb - origin)) / pl.periodDays;
      const phaseErr = Math.hypot(pl.tcErrDays, orbits * pl.periodErrDays) / pl.periodDays;
      if (phaseErr <= 0.03) return;
      for (const shift of [-2, -1, 1, 2]) {
        const shifted = Float64Array.from(start);
        shifted[lay.tc[i]!] += shift * phaseErr * pl.periodDays;
        const fit = fitFrom(shifted);
        if (fit.converged && (!best.converged || fit.chi2 < best.chi2)) best = fit;
      }
    });
    return best;
  }

  function fitFrom(start: Float64Array): { theta: Float64Array; chi2: number; converged: boolean } {
    const theta = Float64Array.from(start);
    let lambda = 1e-3;
    let current = chi2(theta, resid);
    // Whether curves, shapes and velocities hold theta's (chi2 leaves those of its argument).
    let curvesHoldTheta = true;
    let converged = false;
    for (let iter = 0; iter < 60 && !converged; iter++) {
      // Whitened Jacobian: the γ column exact, the others central differences (exact to rounding
      // for K, which enters linearly). A parameter moves one planet's orbit only, so the other
      // planets' velocities at the current theta are computed once and reused. K multiplies the
      // curve of K = 1 m/s, so K ± h needs no new curve.
      if (!curvesHoldTheta) curvesAt(theta);
      for (let j = 0; j < p; j++) {
        if (j === 0) for (let i = 0; i < n; i++) jac[i * p] = 1;
        else {
          const q = planetOfParam[j]!;
          const h = step[j]! || 1e-4 * Math.max(1, Math.abs(theta[j]!));
          const saved = theta[j]!;
          theta[j] = saved + h;
          planetCurve(planets[q]!, q, lay, theta, up);
          theta[j] = saved - h;
          planetCurve(planets[q]!, q, lay, theta, down);
          theta[j] = saved;
          const isK = j === lay.k[q];
          if (!isK) {
            shapeInto(up, tRel, upShape);
            shapeInto(down, tRel, downShape);
          }
          for (let i = 0; i < n; i++) {
            // The sum in modelVelocity's order (γ, then planet by planet), the moved planet recomputed.
            let vUp = theta[0]!;
            let vDown = theta[0]!;
            for (let r = 0; r < planets.length; r++) {
              if (r !== q) {
                vUp += velocities[r * n + i]!;
                vDown += velocities[r * n + i]!;
              } else if (isK) {
                vUp += up.kMps * shapes[q * n + i]!;
                vDown += down.kMps * shapes[q * n + i]!;
              } else {
                vUp += up.kMps * upShape[i]!;
                vDown += down.kMps * downShape[i]!;
              }
            }
            jac[i * p + j] = (vUp - vDown) / (2 * h);
          }
        }
        forward(whiten, n, jac, p, j);
      }
      // Normal equations of the penalised problem: (J̃ᵀJ̃ + Λ) δ = J̃ᵀ r̃ − Λ (θ − θ_cat).
      for (let r = 0; r < p; r++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += jac[i * p + r]! * resid[i]!;
        g[r] = s - (theta[r]! - lay.centre[r]!) * lay.invSigma[r]! ** 2;
        // The matrix is symmetric: each product sum once, for c <= r.
        for (let c = 0; c <= r; c++) {
          let t = 0;
          for (let i = 0; i < n; i++) t += jac[i * p + r]! * jac[i * p + c]!;
          a[r * p + c] = a[c * p + r] = t + (r === c ? lay.invSigma[r]! ** 2 : 0);
        }
      }
      for (let tries = 0; tries < 20; tries++) {
        damped.set(a);
        for (let r = 0; r < p; r++) damped[r * p + r] *= 1 + lambda;
        if (!spdSolve(damped, g, p, delta, factor)) {
          lambda *= 10;
          continue;
        }
        trial.set(theta);
        for (let r = 0; r < p; r++) trial[r] += delta[r]!;
        // K is an amplitude: a step to K <= 0 is refused like one that raises χ².
        if (lay.k.some((k) => !(trial[k]! > 0))) {
          lambda *= 10;
          continue;
        }
        const next = chi2(trial, trialResid);
        curvesHoldTheta = false;
        // Converged when the step is tiny against each parameter's scale (1e-5 m/s for γ and K,
        // 1e-5 of the prior width otherwise).
        let small = true;
        for (let r = 0; r < p; r++) {
          const scale = lay.invSigma[r]! > 0 ? 1e-5 / lay.invSigma[r]! : 1e-5;
          if (Math.abs(delta[r]!) > scale) small = false;
        }
        if (next <= current || (small && next <= current * (1 + 1e-10))) {
          theta.set(trial);
          curvesHoldTheta = true;
          resid.set(trialResid);
          current = next;
          lambda = Math.max(lambda / 10, 1e-9);
          converged = small;
          break;
        }
        lambda *= 10;
      }
      if (lambda > 1e12) break;
    }
    return { theta, chi2: current, converged };
  }
}

/** √(mean of squares). */
export function rms(values: number[]): number {
  return Math.sqrt(values.reduce((s, v) => s + v * v, 0) / values.length);
}

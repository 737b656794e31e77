// A star's RVs fitted jointly for all its planets: Keplerian curves, one offset γ per instrument,
// Gaussian priors from the catalogue ephemeris, by Levenberg–Marquardt on whitened residuals.
import { validationError } from '../errors.js';
import type { FittedOrbit } from './fitted-orbit.js';
import { periastronFromConjunctionBjdTdb } from '../orbit/periastron-time.js';
import { radialVelocityMps } from '../orbit/rv-curve.js';
import { packedIndex } from './information-model.js';
import { levenbergMarquardt, type LeastSquaresProblem, type LeastSquaresResult } from './levenberg-marquardt.js';
import { inversePacked } from './packed-solve.js';

/** A planet as the catalogue gives it: the start and the priors of the fit. An error of 0 holds that value fixed. */
export interface FitPlanetPrior {
  id: string;
  periodDays: number;
  periodErrDays: number;
  /** Mid-transit (inferior conjunction), BJD_TDB. */
  tcBjdTdb: number;
  tcErrDays: number;
  /** Start of K (no prior on K). */
  kMps: number;
  ecc: number;
  omegaDeg: number;
  /** When given, e cos ω and e sin ω are fitted with Gaussian priors of this width about the catalogue values. */
  eccSigma?: number;
}

export interface FitPoint {
  bjdTdb: number;
  rvMps: number;
  rvErrorMps: number;
  instrument: string;
}

/** One planet's fit; its Tc is at the epoch (catalogue Tc + n P) where it is uncorrelated with P. */
export interface PlanetFit extends FittedOrbit {
  id: string;
  ecc: number;
  omegaDeg: number;
  /** Error of e, when e is fitted. */
  eccErr?: number;
}

export interface OrbitFit {
  planets: PlanetFit[];
  /** One offset per instrument, in the order the instruments first appear in the points. */
  offsets: { instrument: string; gammaMps: number; gammaErrMps: number }[];
  /** χ² of the data alone (weights 1/(σ² + jitter²)) and points − free parameters (zero or less when the priors carry the fit). */
  chi2: number;
  dof: number;
  /** Root mean square of the residuals, m/s (unweighted). */
  rmsMps: number;
  points: number;
  /** False when no start reached a minimum (the best point reached is reported). */
  converged: boolean;
}

/** Phase error (cycles) at the middle of the data above which the fit also starts from shifted phases. */
const SHIFT_ABOVE_CYCLES = 0.03;
/** The shifted starts, in units of that phase error. */
const SHIFTS = [-2, -1, 1, 2];
/** Largest eccentricity a fitted orbit may reach (as the target list allows). */
const MAX_ECC = 0.99;

/** Where each planet's parameters sit in θ; −1 for one held fixed. Tc is fitted as days from the catalogue Tc. */
interface Slots {
  k: number;
  tc: number;
  period: number;
  /** e cos ω; e sin ω follows. */
  ecc: number;
}

interface Layout {
  instruments: string[];
  slots: Slots[];
  count: number;
  /** Parameters with a Gaussian prior: slot, centre and 1/σ. */
  priors: { slot: number; centre: number; invSigma: number }[];
}

function buildLayout(planets: FitPlanetPrior[], instruments: string[]): Layout {
  let count = instruments.length;
  const priors: Layout['priors'] = [];
  const slots = planets.map((pl): Slots => {
    const s: Slots = { k: count++, tc: -1, period: -1, ecc: -1 };
    if (pl.tcErrDays > 0) {
      s.tc = count++;
      priors.push({ slot: s.tc, centre: 0, invSigma: 1 / pl.tcErrDays });
    }
    if (pl.periodErrDays > 0) {
      s.period = count++;
      priors.push({ slot: s.period, centre: pl.periodDays, invSigma: 1 / pl.periodErrDays });
    }
    if (pl.eccSigma !== undefined) {
      s.ecc = count;
      count += 2;
      const omega = (pl.omegaDeg * Math.PI) / 180;
      priors.push({ slot: s.ecc, centre: pl.ecc * Math.cos(omega), invSigma: 1 / pl.eccSigma });
      priors.push({ slot: s.ecc + 1, centre: pl.ecc * Math.sin(omega), invSigma: 1 / pl.eccSigma });
    }
    return s;
  });
  return { instruments, slots, count, priors };
}

interface Elements {
  tcBjdTdb: number;
  periodDays: number;
  ecc: number;
  omegaDeg: number;
}

function elements(pl: FitPlanetPrior, s: Slots, theta: ArrayLike<number>): Elements {
  let ecc = pl.ecc;
  let omegaDeg = pl.omegaDeg;
  if (s.ecc >= 0) {
    // e = √(h² + k²), ω = atan2(k, h) for h = e cos ω, k = e sin ω (definition).
    ecc = Math.hypot(theta[s.ecc]!, theta[s.ecc + 1]!);
    if (ecc > 0) omegaDeg = (Math.atan2(theta[s.ecc + 1]!, theta[s.ecc]!) * 180) / Math.PI;
  }
  return {
    tcBjdTdb: pl.tcBjdTdb + (s.tc >= 0 ? theta[s.tc]! : 0),
    periodDays: s.period >= 0 ? theta[s.period]! : pl.periodDays,
    ecc,
    omegaDeg,
  };
}

/** The curve of unit K at t: cos(ν + ω) + e cos ω, with T_p from Tc (src/orbit/periastron-time.ts). */
function unitCurve(el: Elements, tBjdTdb: number): number {
  const periastronBjdTdb = periastronFromConjunctionBjdTdb(el);
  return radialVelocityMps({ kMps: 1, periodDays: el.periodDays, ecc: el.ecc, omegaDeg: el.omegaDeg, periastronBjdTdb }, tBjdTdb);
}

function checkInputs(planets: FitPlanetPrior[], points: FitPoint[], jitterMps: number): void {
  if (points.length === 0) throw validationError('points', 0, 'at least one RV to fit');
  if (!(jitterMps >= 0 && Number.isFinite(jitterMps))) throw validationError('jitterMps', jitterMps, 'a finite jitter of 0 m/s or more');
  points.forEach((pt, i) => {
    if (!Number.isFinite(pt.bjdTdb) || !Number.isFinite(pt.rvMps)) throw validationError(`points[${i}]`, pt, 'a finite time and RV');
    if (!(pt.rvErrorMps > 0 && Number.isFinite(pt.rvErrorMps)))
      throw validationError(`points[${i}].rvErrorMps`, pt.rvErrorMps, 'a positive, finite uncertainty');
  });
  planets.forEach((pl, i) => {
    const ok =
      pl.periodDays > 0 &&
      pl.periodErrDays >= 0 &&
      pl.tcErrDays >= 0 &&
      pl.kMps > 0 &&
      pl.ecc >= 0 &&
      pl.ecc < MAX_ECC &&
      Number.isFinite(pl.tcBjdTdb) &&
      Number.isFinite(pl.omegaDeg);
    if (!ok) throw validationError(`planets[${i}]`, pl.id, 'P > 0, errors of 0 or more, a finite Tc and ω, K > 0 and 0 ≤ e < 0.99');
    if (pl.eccSigma !== undefined && !(pl.eccSigma > 0)) throw validationError(`planets[${i}].eccSigma`, pl.eccSigma, 'a positive prior width');
  });
}

/**
 * Fits the RVs of one star jointly for its planets: v(t) = γ_inst + Σ K_k [cos(ν_k + ω_k) + e_k cos ω_k]
 * ([Kepler-RV]). Free: γ per instrument; per planet K (kept positive: K is an amplitude, common
 * practice), Tc and P when their catalogue errors are above 0, and e cos ω, e sin ω when the
 * planet has eccSigma. Residuals (v_i − model)/√(σ_i² + jitter²) and the Gaussian priors as extra
 * rows (θ − θ_cat)/σ_prior [Kay1993 sect. 3.9]; Levenberg–Marquardt ([Press2007 sect. 15.5]) from
 * the catalogue and from each planet's phase shifted by ±1 and ±2 of its error at the middle of
 * the data (when that error exceeds 0.03 cycles), keeping the lowest penalised χ²: a local fit from
 * the catalogue alone can settle a fraction of a cycle away. Errors from (JᵀWJ + Λ)⁻¹ at the optimum
 * [Press2007 sect. 15.5]. With fewer points than γ's and K's, Tc, P and e keep their priors but a K
 * or γ the data cannot fix makes the matrix singular: then every error is reported as Infinity.
 */
export function fitOrbits(catalogue: FitPlanetPrior[], points: FitPoint[], jitterMps: number): OrbitFit {
  checkInputs(catalogue, points, jitterMps);
  // Times from a whole day before the first point: a full BJD carries ~3e-10 d of rounding,
  // which the finite differences below would turn into a Jacobian wrong by ~1e-5.
  const origin = Math.floor(points.reduce((lo, pt) => Math.min(lo, pt.bjdTdb), Infinity));
  const planets = catalogue.map((pl) => ({ ...pl, tcBjdTdb: pl.tcBjdTdb - origin }));
  const instruments = [...new Set(points.map((pt) => pt.instrument))];
  const lay = buildLayout(planets, instruments);
  const n = points.length;
  const instrumentOf = points.map((pt) => instruments.indexOf(pt.instrument));
  const invSigma = points.map((pt) => 1 / Math.sqrt(pt.rvErrorMps ** 2 + jitterMps ** 2));
  const times = points.map((pt) => pt.bjdTdb - origin);
  const first = times.reduce((lo, t) => Math.min(lo, t), Infinity);
  const last = times.reduce((hi, t) => Math.max(hi, t), -Infinity);

  const model = (theta: ArrayLike<number>, i: number) =>
    planets.reduce((v, pl, k) => v + theta[lay.slots[k]!.k]! * unitCurve(elements(pl, lay.slots[k]!, theta), times[i]!), theta[instrumentOf[i]!]!);

  // Central-difference steps (γ and K enter linearly and get exact columns).
  const step = new Float64Array(lay.count);
  planets.forEach((pl, k) => {
    const s = lay.slots[k]!;
    const orbits = Math.max(1, Math.abs(first - pl.tcBjdTdb) / pl.periodDays, Math.abs(last - pl.tcBjdTdb) / pl.periodDays);
    if (s.tc >= 0) step[s.tc] = 1e-5 * pl.periodDays;
    if (s.period >= 0) step[s.period] = (1e-5 * pl.periodDays) / orbits;
    if (s.ecc >= 0) step[s.ecc] = step[s.ecc + 1] = 1e-6;
  });

  const problem: LeastSquaresProblem = {
    parameters: lay.count,
    residuals: n + lay.priors.length,
    residual(theta, out) {
      for (let i = 0; i < n; i++) out[i] = (points[i]!.rvMps - model(theta, i)) * invSigma[i]!;
      lay.priors.forEach((pr, j) => {
        out[n + j] = (theta[pr.slot]! - pr.centre) * pr.invSigma;
      });
    },
    jacobian(theta, out) {
      out.fill(0);
      const p = lay.count;
      for (let i = 0; i < n; i++) out[i * p + instrumentOf[i]!] = -invSigma[i]!;
      planets.forEach((pl, k) => {
        const s = lay.slots[k]!;
        const kMps = theta[s.k]!;
        const el = elements(pl, s, theta);
        for (let i = 0; i < n; i++) out[i * p + s.k] = -unitCurve(el, times[i]!) * invSigma[i]!;
        for (const slot of [s.tc, s.period, s.ecc, s.ecc >= 0 ? s.ecc + 1 : -1]) {
          if (slot < 0) continue;
          const up = Float64Array.from(theta);
          const down = Float64Array.from(theta);
          up[slot] += step[slot]!;
          down[slot] -= step[slot]!;
          const elUp = elements(pl, s, up);
          const elDown = elements(pl, s, down);
          for (let i = 0; i < n; i++) {
            const d = (kMps * (unitCurve(elUp, times[i]!) - unitCurve(elDown, times[i]!))) / (2 * step[slot]!);
            out[i * p + slot] = -d * invSigma[i]!;
          }
        }
      });
      lay.priors.forEach((pr, j) => {
        out[(n + j) * p + pr.slot] = pr.invSigma;
      });
    },
    admissible: (theta) =>
      lay.slots.every(
        (s) => theta[s.k]! > 0 && (s.ecc < 0 || Math.hypot(theta[s.ecc]!, theta[s.ecc + 1]!) < MAX_ECC) && (s.period < 0 || theta[s.period]! > 0),
      ),
  };

  const best = bestOfStarts(problem, startsFor(planets, points, lay, (first + last) / 2));
  return summarise(planets, points, lay, best, model, origin);
}

/** The catalogue start and, per planet with a loose phase, starts with Tc shifted by SHIFTS phase errors. */
function startsFor(planets: FitPlanetPrior[], points: FitPoint[], lay: Layout, middleBjdTdb: number): Float64Array[] {
  const start = new Float64Array(lay.count);
  lay.instruments.forEach((name, j) => {
    // Weighted mean of the instrument's RVs (common practice).
    const own = points.filter((pt) => pt.instrument === name);
    const w = own.map((pt) => 1 / pt.rvErrorMps ** 2);
    start[j] = own.reduce((s, pt, i) => s + w[i]! * pt.rvMps, 0) / w.reduce((s, v) => s + v, 0);
  });
  planets.forEach((pl, k) => {
    const s = lay.slots[k]!;
    start[s.k] = pl.kMps;
    if (s.period >= 0) start[s.period] = pl.periodDays;
    if (s.ecc >= 0) {
      const omega = (pl.omegaDeg * Math.PI) / 180;
      start[s.ecc] = pl.ecc * Math.cos(omega);
      start[s.ecc + 1] = pl.ecc * Math.sin(omega);
    }
  });
  const starts = [start];
  planets.forEach((pl, k) => {
    const tc = lay.slots[k]!.tc;
    // Phase error at the middle of the data: σ_φ = √(σ_Tc² + (n σ_P)²) / P, n orbits from Tc (propagation of errors, common practice).
    const orbits = (middleBjdTdb - pl.tcBjdTdb) / pl.periodDays;
    const phaseErrCycles = Math.hypot(pl.tcErrDays, orbits * pl.periodErrDays) / pl.periodDays;
    if (tc < 0 || phaseErrCycles <= SHIFT_ABOVE_CYCLES) return;
    for (const shift of SHIFTS) {
      const shifted = Float64Array.from(start);
      // Beyond half a cycle of error every phase is allowed: ±1 and ±2 half-cycles then cover it.
      shifted[tc] = shift * Math.min(phaseErrCycles, 0.5) * pl.periodDays;
      starts.push(shifted);
    }
  });
  return starts;
}

/** The fit of lowest χ² among the converged ones (among all when none converged). */
function bestOfStarts(problem: LeastSquaresProblem, starts: Float64Array[]): LeastSquaresResult {
  const fits = starts.map((start) => levenbergMarquardt(problem, start));
  const pool = fits.some((f) => f.converged) ? fits.filter((f) => f.converged) : fits;
  return pool.reduce((a, b) => (b.chi2 < a.chi2 ? b : a));
}

function summarise(
  planets: FitPlanetPrior[],
  points: FitPoint[],
  lay: Layout,
  fit: LeastSquaresResult,
  model: (theta: ArrayLike<number>, i: number) => number,
  origin: number,
): OrbitFit {
  const { theta } = fit;
  const covariance = inversePacked(fit.normal, lay.count);
  const cov = (a: number, b: number) => (a < 0 || b < 0 ? 0 : covariance ? covariance[packedIndex(a, b)]! : Infinity);
  const sd = (a: number) => Math.sqrt(cov(a, a));
  const planetFits = planets.map((pl, k): PlanetFit => {
    const s = lay.slots[k]!;
    const el = elements(pl, s, theta);
    // The epoch n orbits from the catalogue Tc where Cov(Tc + nP, P) = Cov(Tc, P) + n Var(P) ≈ 0 (propagation of errors).
    const varP = cov(s.period, s.period);
    const epochs = s.tc >= 0 && varP > 0 && Number.isFinite(varP) ? Math.round(-cov(s.tc, s.period) / varP) : 0;
    const varTc = epochs === 0 ? cov(s.tc, s.tc) : cov(s.tc, s.tc) + 2 * epochs * cov(s.tc, s.period) + epochs * epochs * varP;
    const out: PlanetFit = {
      id: pl.id,
      kMps: theta[s.k]!,
      kErrMps: sd(s.k),
      tcBjdTdb: origin + el.tcBjdTdb + epochs * el.periodDays,
      tcErrDays: Math.sqrt(varTc),
      periodDays: el.periodDays,
      periodErrDays: sd(s.period),
      ecc: el.ecc,
      omegaDeg: ((el.omegaDeg % 360) + 360) % 360,
    };
    if (s.ecc >= 0) out.eccErr = eccentricityError(theta[s.ecc]!, theta[s.ecc + 1]!, cov(s.ecc, s.ecc), cov(s.ecc, s.ecc + 1), cov(s.ecc + 1, s.ecc + 1));
    return out;
  });
  // The data's χ²: the penalised χ² less the prior rows.
  const chi2 = lay.priors.reduce((c, pr) => c - ((theta[pr.slot]! - pr.centre) * pr.invSigma) ** 2, fit.chi2);
  const squares = points.reduce((sum, pt, i) => sum + (pt.rvMps - model(theta, i)) ** 2, 0);
  return {
    planets: planetFits,
    offsets: lay.instruments.map((instrument, j) => ({ instrument, gammaMps: theta[j]!, gammaErrMps: sd(j) })),
    chi2,
    dof: points.length - lay.count,
    rmsMps: Math.sqrt(squares / points.length),
    points: points.length,
    converged: fit.converged,
  };
}

/**
 * σ_e of e = √(h² + k²) by propagation of errors: σ_e² = (h² σ_h² + 2hk σ_hk + k² σ_k²) / e²
 * (common practice); at e = 0, where e is not differentiable, the larger of σ_h and σ_k.
 */
function eccentricityError(h: number, k: number, varH: number, covHK: number, varK: number): number {
  const e2 = h * h + k * k;
  if (e2 === 0) return Math.sqrt(Math.max(varH, varK));
  return Math.sqrt((h * h * varH + 2 * h * k * covHK + k * k * varK) / e2);
}

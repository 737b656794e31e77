import { choleskyInPlace } from './packed-cholesky.js';
import { packedIndex, packedLength } from './information-model.js';
import { solveWithFactor } from './packed-solve.js';

/** A least-squares problem on whitened residuals r(θ): minimise χ² = Σ r². */
export interface LeastSquaresProblem {
  parameters: number;
  residuals: number;
  /** Fills out (length `residuals`) with r(θ). */
  residual(theta: Float64Array, out: Float64Array): void;
  /** Fills out (row-major residuals × parameters) with ∂r/∂θ. */
  jacobian(theta: Float64Array, out: Float64Array): void;
  /** False for a θ the model refuses (a step there is treated like one that raises χ²). */
  admissible(theta: Float64Array): boolean;
}

export interface LeastSquaresResult {
  theta: Float64Array;
  chi2: number;
  /** True when the last Gauss–Newton step was below 1e-6 of every parameter's error. */
  converged: boolean;
  /** JᵀJ at theta (packed lower triangle): the inverse is the parameters' covariance. */
  normal: Float64Array;
}

const MAX_ITERATIONS = 200;
const STEP_TOLERANCE = 1e-6;

const sumSquares = (r: Float64Array) => r.reduce((s, v) => s + v * v, 0);

/**
 * Levenberg–Marquardt [Press2007 sect. 15.5.2]: solve (JᵀJ + λ diag(JᵀJ)) δ = −Jᵀr; accept the step
 * and divide λ by 10 when χ² does not rise, else multiply λ by 10. Converged when every component
 * of a nearly undamped step (λ ≤ 1) is below STEP_TOLERANCE of that parameter's error: |δ_j| √(JᵀJ)_jj.
 */
export function levenbergMarquardt(problem: LeastSquaresProblem, start: ArrayLike<number>): LeastSquaresResult {
  const p = problem.parameters;
  const m = problem.residuals;
  const theta = Float64Array.from(start);
  const r = new Float64Array(m);
  const trialR = new Float64Array(m);
  const jac = new Float64Array(m * p);
  const normal = new Float64Array(packedLength(p));
  const gradient = new Float64Array(p);
  problem.residual(theta, r);
  let chi2 = sumSquares(r);
  let lambda = 1e-3;
  let converged = false;

  const linearise = () => {
    problem.jacobian(theta, jac);
    for (let a = 0; a < p; a++) {
      let g = 0;
      for (let i = 0; i < m; i++) g -= jac[i * p + a]! * r[i]!;
      gradient[a] = g;
      for (let b = 0; b <= a; b++) {
        let s = 0;
        for (let i = 0; i < m; i++) s += jac[i * p + a]! * jac[i * p + b]!;
        normal[packedIndex(a, b)] = s;
      }
    }
  };

  linearise();
  for (let iteration = 0; iteration < MAX_ITERATIONS && !converged && lambda < 1e12; iteration++) {
    const damped = Float64Array.from(normal);
    for (let a = 0; a < p; a++) damped[packedIndex(a, a)] *= 1 + lambda;
    if (!choleskyInPlace(damped, p)) {
      lambda *= 10;
      continue;
    }
    const delta = solveWithFactor(damped, p, gradient);
    const trial = theta.map((v, a) => v + delta[a]!);
    // A tiny step of a nearly undamped (Gauss–Newton) solve is the end, whether or not rounding let
    // it lower χ²; a step made tiny by heavy damping is not.
    const small = lambda <= 1 && delta.every((d, a) => Math.abs(d) * Math.sqrt(normal[packedIndex(a, a)]!) < STEP_TOLERANCE);
    if (!problem.admissible(trial)) {
      lambda *= 10;
      continue;
    }
    problem.residual(trial, trialR);
    const next = sumSquares(trialR);
    if (next <= chi2) {
      theta.set(trial);
      r.set(trialR);
      chi2 = next;
      lambda = Math.max(lambda / 10, 1e-12);
      linearise();
    } else lambda *= 10;
    converged = small;
  }
  return { theta, chi2, converged, normal };
}

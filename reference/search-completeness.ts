// The slow reference of a search's completeness (src/schedule/objective-search.ts): per grid
// frequency a direct 3x3 weighted least-squares information matrix, its inverse by Gauss-Jordan
// elimination and the sine/cosine block of the inverse inverted again (the covariance of the
// amplitudes; its inverse is the Schur complement), the threshold from src/rv/fap.ts's own
// context of the visit times, and the phase average either by the midpoint rule in the orbital
// phase on many nodes with the Poisson series of Marcum's Q ('exact'), or on the scheduler's own
// nodes and table ('scheduler', which then checks the running sums and the threshold to rounding).
import { fapContext, powerAtFap } from '../src/rv/fap.js';
import { marcumQ1 } from '../src/rv/marcum-q.js';
import { marcumQ1Lookup, marcumQ1Table } from '../src/rv/marcum-q.js';
import { MIN_SEARCH_VISITS, PHASE_NODES, type SearchGrid } from '../src/schedule/objective-search.js';

/** Inverse of a small matrix by Gauss-Jordan elimination with partial pivoting (common practice). */
export function inverse(matrix: number[][]): number[][] {
  const n = matrix.length;
  const a = matrix.map((row, r) => [...row, ...Array.from({ length: n }, (_, k) => (k === r ? 1 : 0))]);
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(a[r]![col]!) > Math.abs(a[pivot]![col]!)) pivot = r;
    [a[pivot], a[col]] = [a[col]!, a[pivot]!];
    const d = a[col]![col]!;
    for (let k = 0; k < 2 * n; k++) a[col]![k]! /= d;
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const f = a[r]![col]!;
      for (let k = 0; k < 2 * n; k++) a[r]![k]! -= f * a[col]![k]!;
    }
  }
  return a.map((row) => row.slice(n));
}

/** Completeness of visits (times in days, weights 1/sigma^2) on the grid (see the file comment for the modes). */
export function referenceCompleteness(grid: SearchGrid, timesDays: number[], weights: number[], mode: 'exact' | 'scheduler', nodes = 64): number {
  const n = timesDays.length;
  if (n < MIN_SEARCH_VISITS) return 0;
  const f0 = grid.angularFreq[0]! / (2 * Math.PI);
  const ctx = fapContext(
    timesDays,
    weights.map((w) => 1 / Math.sqrt(w)),
    { startPerDay: f0, stepPerDay: grid.bandPerDay, count: 2, baselineDays: grid.spanDays, minPeriodDays: 1, maxPeriodDays: 2, oversample: 1 },
  );
  const p = powerAtFap(grid.fap, ctx);
  const b = Math.sqrt(((n - 3) * p) / (1 - p));
  let total = 0;
  for (let k = 0; k < grid.angularFreq.length; k++) {
    const m = [0, 1, 2].map((r) => [0, 1, 2].map((c) => (r === c ? grid.eps : 0)));
    timesDays.forEach((t, i) => {
      const x = [1, Math.sin(grid.angularFreq[k]! * t), Math.cos(grid.angularFreq[k]! * t)];
      for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) m[r]![c]! += weights[i]! * x[r]! * x[c]!;
    });
    const cov = inverse(m);
    const s = inverse([
      [cov[1]![1]!, cov[1]![2]!],
      [cov[2]![1]!, cov[2]![2]!],
    ]);
    if (mode === 'scheduler') {
      // lambda = K^2 (m + r cos theta) on the scheduler's nodes theta_i = pi (i + 1/2) / PHASE_NODES.
      const m = 0.5 * (s[0]![0]! + s[1]![1]!);
      const r = Math.hypot(0.5 * (s[0]![0]! - s[1]![1]!), s[0]![1]!);
      let pk = 0;
      for (let i = 0; i < PHASE_NODES; i++) {
        const lambda = grid.kSq[k]! * (m + r * Math.cos((Math.PI * (i + 0.5)) / PHASE_NODES));
        pk += marcumQ1Lookup(marcumQ1Table(), Math.sqrt(Math.max(0, lambda)), b);
      }
      total += (grid.logPWeight[k]! * pk) / PHASE_NODES;
      continue;
    }
    let pk = 0;
    for (let i = 0; i < nodes; i++) {
      // Phase phi over [0, pi) (the tail depends on phi modulo pi); u = (cos phi, sin phi).
      const phi = (Math.PI * (i + 0.5)) / nodes;
      const u = [Math.cos(phi), Math.sin(phi)];
      const lambda = grid.kSq[k]! * (u[0]! * u[0]! * s[0]![0]! + 2 * u[0]! * u[1]! * s[0]![1]! + u[1]! * u[1]! * s[1]![1]!);
      pk += marcumQ1(Math.sqrt(Math.max(0, lambda)), b);
    }
    total += (grid.logPWeight[k]! * pk) / nodes;
  }
  return total;
}

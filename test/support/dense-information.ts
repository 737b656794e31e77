// A slow, direct Cramér–Rao reference for the K variances of src/rv/information.ts, built
// independently of information-model.ts's design rows:
//  - the RV model v(t; θ) = γ + Σ K [cos(ν + ω) + e cos ω] from src/orbit/rv-curve.ts, the
//    periastron placed from the transit time by src/orbit/periastron-time.ts;
//  - its derivatives by the 5-point central stencil f' ≈ [f(−2h) − 8f(−h) + 8f(h) − f(2h)] / 12h
//    (common practice; error O(h⁴)) with respect to γ, Tc_ref, P, e cos ω, e sin ω and K;
//  - converted to the module's phase parameters: α = δTc_ref / P, β = δP U / P (so
//    ∂v/∂α = P ∂v/∂Tc_ref, ∂v/∂β = (P / U) ∂v/∂P, Tc_ref held), the transit held fixed when
//    the eccentricity vector moves;
//  - the dense n × n noise covariance C_ij = σ_i² δ_ij + τ² [same night] + k_activity(t_n(i) − t_n(j));
//  - the prior precision built here from the catalogue errors: Tc_ref = Tc + n P, so
//    Var δTc_ref = σ_Tc² + n² σ_P², Cov(δTc_ref, δP) = n σ_P² (common practice);
//  - F = Jᵀ C⁻¹ J + Λ and Var(K) = (F⁻¹)_KK by Gaussian elimination with partial pivoting
//    (common practice), averaged over the model's sample ephemerides with their weights.
// Only the reference epoch Tc_ref, the scale U (orbitsScale) and the sample shifts and weights
// are read from the model object.
import { periastronFromConjunctionBjdTdb } from '../../src/orbit/periastron-time.js';
import { radialVelocityMps } from '../../src/orbit/rv-curve.js';
import { activityCovariance } from '../../src/rv/activity-kernel.js';
import type { StarModel } from '../../src/rv/information-model.js';

export interface DenseVisit {
  bjdTdb: number;
  whiteSigmaMps: number;
  night: number;
  nightBjdTdb: number;
}

/** The floor information-model.ts puts on σ_Tc when only the period is uncertain (days). */
const TC_FLOOR_DAYS = 1e-6;

interface PlanetState {
  /** Transit time relative to the origin (days). */
  tc: number;
  period: number;
  x: number;
  y: number;
  k: number;
  /** Eccentricity and ω (deg) used when the eccentricity vector is not varied. */
  ecc: number;
  omegaDeg: number;
  eccVector: boolean;
}

/** γ + Σ planets K [cos(ν + ω) + e cos ω] at time tRel (days from the origin). */
function velocity(gamma: number, planets: PlanetState[], tRel: number): number {
  let v = gamma;
  for (const pl of planets) {
    let ecc = pl.ecc;
    let omegaDeg = pl.omegaDeg;
    if (pl.eccVector) {
      ecc = Math.hypot(pl.x, pl.y);
      omegaDeg = ecc > 0 ? (Math.atan2(pl.y, pl.x) * 180) / Math.PI : 90;
    }
    const periastronBjdTdb = periastronFromConjunctionBjdTdb({ tcBjdTdb: pl.tc, periodDays: pl.period, ecc, omegaDeg });
    v += radialVelocityMps({ kMps: pl.k, periodDays: pl.period, ecc, omegaDeg, periastronBjdTdb }, tRel);
  }
  return v;
}

/** 5-point central derivative of f at 0 with step h. */
function stencil(f: (d: number) => number, h: number): number {
  return (f(-2 * h) - 8 * f(-h) + 8 * f(h) - f(2 * h)) / (12 * h);
}

/** Solves A X = B (A n×n, B n×m, row-major arrays of rows) by Gaussian elimination with partial pivoting; null if singular. */
export function solveDense(a: number[][], b: number[][]): number[][] | null {
  const n = a.length;
  const m = b[0]!.length;
  const aa = a.map((row) => row.slice());
  const bb = b.map((row) => row.slice());
  // Singular when a pivot vanishes against its own column's size (the prior and the data differ in
  // scale by many orders, so one scale for the whole matrix would call a good K column singular).
  const scale = aa[0]!.map((_, c) => Math.max(...aa.map((row) => Math.abs(row[c]!))));
  for (let col = 0; col < n; col++) {
    let piv = col;
    for (let r = col + 1; r < n; r++) if (Math.abs(aa[r]![col]!) > Math.abs(aa[piv]![col]!)) piv = r;
    if (!(Math.abs(aa[piv]![col]!) > 1e-12 * scale[col]!)) return null;
    [aa[col], aa[piv]] = [aa[piv]!, aa[col]!];
    [bb[col], bb[piv]] = [bb[piv]!, bb[col]!];
    const lead = aa[col]![col]!;
    for (let r = col + 1; r < n; r++) {
      const f = aa[r]![col]! / lead;
      if (f === 0) continue;
      for (let c = col; c < n; c++) aa[r]![c]! -= f * aa[col]![c]!;
      for (let c = 0; c < m; c++) bb[r]![c]! -= f * bb[col]![c]!;
    }
  }
  const x = Array.from({ length: n }, () => new Array<number>(m).fill(0));
  for (let r = n - 1; r >= 0; r--) {
    for (let c = 0; c < m; c++) {
      let s = bb[r]![c]!;
      for (let k = r + 1; k < n; k++) s -= aa[r]![k]! * x[k]![c]!;
      x[r]![c] = s / aa[r]![r]!;
    }
  }
  return x;
}

/** The dense noise covariance of the visits (see the file comment). */
export function denseCovariance(model: StarModel, visits: DenseVisit[]): number[][] {
  const tau2 = model.input.nightlyJitterMps ** 2;
  const act = model.input.activity;
  return visits.map((vi, i) =>
    visits.map((vj, j) => {
      let c = i === j ? vi.whiteSigmaMps * vi.whiteSigmaMps : 0;
      if (vi.night === vj.night) c += tau2;
      if (act) c += activityCovariance(act, vi.nightBjdTdb - vj.nightBjdTdb);
      return c;
    }),
  );
}

/** Var(K) of each planet from the dense computation; Infinity where F is singular. */
export function denseKVariances(model: StarModel, visits: DenseVisit[]): Float64Array {
  const input = model.input;
  const planets = input.planets;
  const origin = model.planets[0]!.tcRefBjdTdb;
  const tRel = visits.map((v) => v.bjdTdb - origin);
  // Own parameter order: γ, per planet [α][β][x y], then the K's.
  type Slot = { kind: 'gamma' } | { kind: 'alpha' | 'beta' | 'x' | 'y' | 'k'; planet: number };
  const slots: Slot[] = [{ kind: 'gamma' }];
  planets.forEach((pl, i) => {
    if (pl.tcErrDays > 0 || pl.periodErrDays > 0) slots.push({ kind: 'alpha', planet: i });
    if (pl.periodErrDays > 0) slots.push({ kind: 'beta', planet: i });
    if ((pl.eccPriorSigma ?? 0) > 0) slots.push({ kind: 'x', planet: i }, { kind: 'y', planet: i });
  });
  const kSlot = planets.map((_, i) => {
    slots.push({ kind: 'k', planet: i });
    return slots.length - 1;
  });
  const p = slots.length;

  // Prior precision from the catalogue errors.
  const prior = Array.from({ length: p }, () => new Array<number>(p).fill(0));
  planets.forEach((pl, i) => {
    const ia = slots.findIndex((s) => s.kind === 'alpha' && s.planet === i);
    const ib = slots.findIndex((s) => s.kind === 'beta' && s.planet === i);
    const ix = slots.findIndex((s) => s.kind === 'x' && s.planet === i);
    const u = model.planets[i]!.orbitsScale;
    const n = Math.round((model.planets[i]!.tcRefBjdTdb - pl.tcBjdTdb) / pl.periodDays);
    const sp = pl.periodErrDays;
    const st = sp > 0 ? Math.max(pl.tcErrDays, TC_FLOOR_DAYS) : pl.tcErrDays;
    if (ia >= 0 && ib < 0) prior[ia]![ia] = (pl.periodDays * pl.periodDays) / (st * st);
    if (ib >= 0) {
      // Covariance of (α, β) = (δTc_ref / P, δP U / P), inverted.
      const P2 = pl.periodDays * pl.periodDays;
      const aa = (st * st + n * n * sp * sp) / P2;
      const ab = (n * sp * sp * u) / P2;
      const bb = (sp * sp * u * u) / P2;
      const det = aa * bb - ab * ab;
      prior[ia]![ia] = bb / det;
      prior[ia]![ib] = -ab / det;
      prior[ib]![ia] = -ab / det;
      prior[ib]![ib] = aa / det;
    }
    if (ix >= 0) {
      prior[ix]![ix] = 1 / pl.eccPriorSigma! ** 2;
      prior[ix + 1]![ix + 1] = 1 / pl.eccPriorSigma! ** 2;
    }
  });

  const cov = denseCovariance(model, visits);
  const out = new Float64Array(planets.length);
  for (const sample of model.samples) {
    const base: PlanetState[] = planets.map((pl, i) => {
      const om = (pl.omegaDeg * Math.PI) / 180;
      return {
        tc: model.planets[i]!.tcRefBjdTdb - origin + sample.alpha[i]! * pl.periodDays,
        period: pl.periodDays * (1 + sample.beta[i]! / model.planets[i]!.orbitsScale),
        x: pl.ecc * Math.cos(om),
        y: pl.ecc * Math.sin(om),
        k: pl.kMps,
        ecc: pl.ecc,
        omegaDeg: pl.omegaDeg,
        eccVector: (pl.eccPriorSigma ?? 0) > 0,
      };
    });
    const jac = tRel.map((t) =>
      slots.map((slot) => {
        if (slot.kind === 'gamma') return stencil((d) => velocity(d, base, t), 1e-3);
        const i = slot.planet;
        const pl = planets[i]!;
        const u = model.planets[i]!.orbitsScale;
        const moved = (field: 'tc' | 'period' | 'x' | 'y' | 'k') => (d: number) =>
          velocity(
            0,
            base.map((b, j) => (j === i ? { ...b, [field]: b[field] + d } : b)),
            t,
          );
        switch (slot.kind) {
          case 'alpha':
            return pl.periodDays * stencil(moved('tc'), 1e-4 * pl.periodDays);
          case 'beta':
            return (pl.periodDays / u) * stencil(moved('period'), (1e-4 * pl.periodDays) / Math.max(1, u));
          case 'x':
            return stencil(moved('x'), 1e-4);
          case 'y':
            return stencil(moved('y'), 1e-4);
          case 'k':
            return stencil(moved('k'), 1e-3);
        }
        throw new Error(`no derivative for the slot kind of ${JSON.stringify(slot)}`);
      }),
    );
    const cInvJ = solveDense(cov, jac)!;
    const f = prior.map((row, r) => row.map((v, c) => v + jac.reduce((s, jrow, i) => s + jrow[r]! * cInvJ[i]![c]!, 0)));
    // Jacobi scaling D^(-1/2) F D^(-1/2) first (common practice), so that a very tight prior
    // (the floor on σ_Tc) does not swamp the singularity test: (F⁻¹)_KK = (F̃⁻¹)_KK / D_K.
    const d = f.map((row, r) => Math.sqrt(row[r]!));
    const scaled = f.map((row, r) => row.map((v, c) => v / (d[r]! * d[c]!)));
    const inv = d.every((v) => v > 0)
      ? solveDense(
          scaled,
          f.map((_, r) => kSlot.map((k) => (r === k ? 1 : 0))),
        )
      : null;
    kSlot.forEach((k, i) => {
      out[i] += inv ? (sample.weight * inv[k]![i]!) / (d[k]! * d[k]!) : Infinity;
    });
  }
  return out;
}

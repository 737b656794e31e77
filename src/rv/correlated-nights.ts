// The nightly-mean part of a star's information when its activity correlates nights
// (information.ts): G = Ūᵀ M⁻¹ Ū with M = diag(1/W_n) + τ² I + K_activity over the star's m
// observed nights. M⁻¹ (P below) and H = M⁻¹ Ū are kept explicitly and changed by exact
// formulas ([Golub-VanLoan2013] §2.1.4 and the block inverse of a bordered matrix):
//  - a new night (bordering M with column ā and corner a): b = P ā, s = a − āᵀ b,
//    r = ū − Hᵀ ā; G += r rᵀ / s; P gains b bᵀ/s in the old block, −b/s and 1/s in the border;
//  - a night's weight and mean change (M_qq += Δ, ū_q += d): with h = H_q and
//    β = Δ / (1 + Δ P_qq), G += h dᵀ + d hᵀ + P_qq d dᵀ − β (h + P_qq d)(h + P_qq d)ᵀ
//    (Sherman–Morrison), P −= β p pᵀ, H += p (d − β (h + P_qq d))ᵀ with p = P e_q;
//  - a night's last visit removed (its variance made infinite): G −= h hᵀ / P_qq,
//    P ← P₋q₋q − P₋q,q P_q,₋q / P_qq, H₋q ← H₋q − P₋q,q h / P_qq.
// Every REFRESH_EVERY changes P, H and G are recomputed from M, so rounding cannot build up.
import { activityCovariance } from './activity-kernel.js';
import type { ActivityInput } from './information-model.js';
import { packedLength } from './information-model.js';
import type { InformationVisit } from './information.js';

const REFRESH_EVERY = 64;

export class CorrelatedNights {
  private m = 0;
  private cap = 0;
  private pm = new Float64Array(0);
  /** Per night position: H rows and mean design rows ū, sampleCount × p each. */
  private h = new Float64Array(0);
  private ubar = new Float64Array(0);
  private times = new Float64Array(0);
  private weights = new Float64Array(0);
  private keys: number[] = [];
  private readonly position = new Map<number, number>();
  private readonly g: Float64Array;
  private readonly row: number;
  private readonly packed: number;
  private changes = 0;
  private scratchA = new Float64Array(0);
  private scratchB = new Float64Array(0);
  private readonly d: Float64Array;
  private readonly x: Float64Array;

  constructor(
    private readonly activity: ActivityInput,
    private readonly tau2: number,
    private readonly samples: number,
    private readonly p: number,
  ) {
    this.row = samples * p;
    this.packed = packedLength(p);
    this.g = new Float64Array(samples * this.packed);
    this.d = new Float64Array(p);
    this.x = new Float64Array(p);
  }

  clear(): void {
    this.m = 0;
    this.keys = [];
    this.position.clear();
    this.g.fill(0);
    this.changes = 0;
  }

  /** work += G of sample s. */
  addTo(work: Float64Array, s: number): void {
    const at = s * this.packed;
    for (let i = 0; i < this.packed; i++) work[i] += this.g[at + i]!;
  }

  private grow(): void {
    const cap = Math.max(8, this.cap * 2);
    const pm = new Float64Array(cap * cap);
    for (let i = 0; i < this.m; i++) pm.set(this.pm.subarray(i * this.cap, i * this.cap + this.m), i * cap);
    const resize = (a: Float64Array, width: number) => {
      const out = new Float64Array(cap * width);
      out.set(a.subarray(0, this.m * width));
      return out;
    };
    this.h = resize(this.h, this.row);
    this.ubar = resize(this.ubar, this.row);
    this.times = resize(this.times, 1);
    this.weights = resize(this.weights, 1);
    this.pm = pm;
    this.cap = cap;
    this.scratchA = new Float64Array(cap);
    this.scratchB = new Float64Array(cap);
  }

  /** ā (kernel to the existing nights) in scratchA, b = P ā in scratchB; returns s = a − āᵀ b. */
  private border(nightBjdTdb: number, weight: number): number {
    const { m, cap, pm } = this;
    const a = this.scratchA;
    const b = this.scratchB;
    for (let i = 0; i < m; i++) a[i] = activityCovariance(this.activity, nightBjdTdb - this.times[i]!);
    let ab = 0;
    for (let i = 0; i < m; i++) {
      let sum = 0;
      for (let k = 0; k < m; k++) sum += pm[i * cap + k]! * a[k]!;
      b[i] = sum;
      ab += a[i]! * sum;
    }
    return 1 / weight + this.tau2 + activityCovariance(this.activity, 0) - ab;
  }

  /** r = j − Hᵀ ā for sample s, into this.d. */
  private residual(rows: Float64Array, offset: number, s: number): void {
    const { p, row, h, d } = this;
    const a = this.scratchA;
    for (let c = 0; c < p; c++) d[c] = rows[offset + s * p + c]!;
    for (let i = 0; i < this.m; i++) for (let c = 0; c < p; c++) d[c] -= a[i]! * h[i * row + s * p + c]!;
  }

  /** Adds to out (samples × packed) the change of G when v is added (sign 1) or removed (-1). */
  addDelta(v: InformationVisit, sign: 1 | -1, nightWeight: number, nightU: Float64Array | undefined, out: Float64Array): void {
    const q = this.position.get(v.night);
    if (q === undefined) {
      if (this.m === this.cap) this.grow();
      const s = this.border(v.nightBjdTdb, v.weight);
      for (let k = 0; k < this.samples; k++) {
        this.residual(v.rows, v.offset, k);
        addOuter(out, k * this.packed, this.p, this.d, this.d, 1 / s);
      }
      return;
    }
    this.changeTerms(v, sign, nightWeight, nightU!, q, (k, h, pqq, beta) => {
      const { d, x, p } = this;
      const at = k * this.packed;
      if (beta === undefined) return addOuter(out, at, p, h, h, -1 / pqq);
      addOuter(out, at, p, h, d, 1);
      addOuter(out, at, p, d, h, 1);
      addOuter(out, at, p, d, d, pqq);
      for (let c = 0; c < p; c++) x[c] = h[c]! + pqq * d[c]!;
      addOuter(out, at, p, x, x, -beta);
    });
  }

  /**
   * For a change to existing night q: per sample k, calls visit(k, h, P_qq, β) with this.d = ū' − ū;
   * β undefined when the night loses its last visit.
   */
  private changeTerms(
    v: InformationVisit,
    sign: 1 | -1,
    nightWeight: number,
    nightU: Float64Array,
    q: number,
    visit: (k: number, h: Float64Array, pqq: number, beta: number | undefined) => void,
  ): void {
    const after = nightWeight + sign * v.weight;
    const pqq = this.pm[q * this.cap + q]!;
    const removed = after <= 1e-9 * v.weight;
    const delta = removed ? 0 : 1 / after - 1 / nightWeight;
    const beta = removed ? undefined : delta / (1 + delta * pqq);
    const { p, d } = this;
    for (let k = 0; k < this.samples; k++) {
      const h = this.h.subarray(q * this.row + k * p, q * this.row + (k + 1) * p);
      if (!removed)
        for (let c = 0; c < p; c++) d[c] = (nightU[k * p + c]! + sign * v.weight * v.rows[v.offset + k * p + c]!) / after - nightU[k * p + c]! / nightWeight;
      visit(k, h, pqq, beta);
    }
  }

  /** Applies the change of addDelta to G, P and H. */
  commit(v: InformationVisit, sign: 1 | -1, nightWeight: number, nightU: Float64Array | undefined): void {
    const q = this.position.get(v.night);
    this.addDelta(v, sign, nightWeight, nightU, this.g);
    const { p, row, cap } = this;
    if (q === undefined) this.addNight(v);
    else {
      const after = nightWeight + sign * v.weight;
      if (after <= 1e-9 * v.weight) this.deleteNight(q);
      else {
        const column = Float64Array.from({ length: this.m }, (_, i) => this.pm[i * cap + q]!);
        let betaUsed = 0;
        this.changeTerms(v, sign, nightWeight, nightU!, q, (k, h, pqq, beta) => {
          betaUsed = beta!;
          const { d, x } = this;
          for (let c = 0; c < p; c++) x[c] = d[c]! - beta! * (h[c]! + pqq * d[c]!);
          for (let i = 0; i < this.m; i++) for (let c = 0; c < p; c++) this.h[i * row + k * p + c] += column[i]! * x[c]!;
          for (let c = 0; c < p; c++) this.ubar[q * row + k * p + c] += d[c]!;
        });
        for (let i = 0; i < this.m; i++) for (let k = 0; k < this.m; k++) this.pm[i * cap + k] -= betaUsed * column[i]! * column[k]!;
        this.weights[q] = after;
      }
    }
    if (++this.changes % REFRESH_EVERY === 0) this.refresh();
  }

  private addNight(v: InformationVisit): void {
    const { m, cap, p, row, pm } = this;
    const s = this.border(v.nightBjdTdb, v.weight);
    const b = this.scratchB;
    const rs = new Float64Array(row);
    for (let k = 0; k < this.samples; k++) {
      this.residual(v.rows, v.offset, k);
      rs.set(this.d, k * p);
    }
    for (let i = 0; i < m; i++) {
      for (let k = 0; k < m; k++) pm[i * cap + k] += (b[i]! * b[k]!) / s;
      pm[i * cap + m] = -b[i]! / s;
      pm[m * cap + i] = -b[i]! / s;
      for (let c = 0; c < row; c++) this.h[i * row + c] -= (b[i]! * rs[c]!) / s;
    }
    pm[m * cap + m] = 1 / s;
    for (let c = 0; c < row; c++) this.h[m * row + c] = rs[c]! / s;
    this.ubar.set(v.rows.subarray(v.offset, v.offset + row), m * row);
    this.times[m] = v.nightBjdTdb;
    this.weights[m] = v.weight;
    this.keys[m] = v.night;
    this.position.set(v.night, m);
    this.m++;
  }

  private deleteNight(q: number): void {
    const { cap, row, pm } = this;
    const m = this.m;
    const pqq = pm[q * cap + q]!;
    const column = Float64Array.from({ length: m }, (_, i) => pm[i * cap + q]!);
    for (let i = 0; i < m; i++) {
      if (i === q) continue;
      for (let k = 0; k < m; k++) if (k !== q) pm[i * cap + k] -= (column[i]! * column[k]!) / pqq;
      for (let c = 0; c < row; c++) this.h[i * row + c] -= (column[i]! * this.h[q * row + c]!) / pqq;
    }
    // Move the last night into position q.
    const last = m - 1;
    this.position.delete(this.keys[q]!);
    if (q !== last) {
      for (let i = 0; i < m; i++) {
        pm[i * cap + q] = pm[i * cap + last]!;
      }
      for (let k = 0; k < m; k++) pm[q * cap + k] = pm[last * cap + k]!;
      pm[q * cap + q] = pm[last * cap + last]!;
      this.h.copyWithin(q * row, last * row, (last + 1) * row);
      this.ubar.copyWithin(q * row, last * row, (last + 1) * row);
      this.times[q] = this.times[last]!;
      this.weights[q] = this.weights[last]!;
      this.keys[q] = this.keys[last]!;
      this.position.set(this.keys[q]!, q);
    }
    this.keys.length = last;
    this.m = last;
  }

  /** P = M⁻¹ (Gauss–Jordan on the symmetric positive-definite M), H = P Ū, G = Ūᵀ H, afresh. */
  private refresh(): void {
    const { m, cap, p, row } = this;
    const a = new Float64Array(m * 2 * m);
    for (let i = 0; i < m; i++) {
      for (let k = 0; k < m; k++)
        a[i * 2 * m + k] = activityCovariance(this.activity, this.times[i]! - this.times[k]!) + (i === k ? 1 / this.weights[i]! + this.tau2 : 0);
      a[i * 2 * m + m + i] = 1;
    }
    for (let col = 0; col < m; col++) {
      const pivot = a[col * 2 * m + col]!;
      for (let k = 0; k < 2 * m; k++) a[col * 2 * m + k] /= pivot;
      for (let i = 0; i < m; i++) {
        if (i === col) continue;
        const f = a[i * 2 * m + col]!;
        if (f !== 0) for (let k = 0; k < 2 * m; k++) a[i * 2 * m + k] -= f * a[col * 2 * m + k]!;
      }
    }
    for (let i = 0; i < m; i++) for (let k = 0; k < m; k++) this.pm[i * cap + k] = a[i * 2 * m + m + k]!;
    this.h.fill(0, 0, m * row);
    for (let i = 0; i < m; i++)
      for (let k = 0; k < m; k++) for (let c = 0; c < row; c++) this.h[i * row + c] += this.pm[i * cap + k]! * this.ubar[k * row + c]!;
    this.g.fill(0);
    for (let s = 0; s < this.samples; s++) {
      for (let i = 0; i < m; i++)
        addOuter(
          this.g,
          s * this.packed,
          p,
          this.ubar.subarray(i * row + s * p, i * row + (s + 1) * p),
          this.h.subarray(i * row + s * p, i * row + (s + 1) * p),
          1,
        );
    }
  }
}

/** out[at ..] (packed lower) += scale × x yᵀ (only the lower triangle of x yᵀ is read: add both orders for a symmetric sum). */
function addOuter(out: Float64Array, at: number, p: number, x: ArrayLike<number>, y: ArrayLike<number>, scale: number): void {
  let idx = at;
  for (let r = 0; r < p; r++) for (let c = 0; c <= r; c++) out[idx++] += scale * x[r]! * y[c]!;
}

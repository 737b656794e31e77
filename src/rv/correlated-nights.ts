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
  /** A column of P, for commits. */
  private scratchColumn = new Float64Array(0);
  /** The night time whose ā and b = P ā scratchA and scratchB hold (with āᵀ b), until the next commit; NaN when none. */
  private borderBjdTdb = Number.NaN;
  private borderAb = 0;
  private readonly kernelAtZero: number;
  private readonly d: Float64Array;
  private readonly x: Float64Array;
  /** The residuals of a new night, sampleCount × p. */
  private readonly rs: Float64Array;

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
    this.rs = new Float64Array(this.row);
    this.kernelAtZero = activityCovariance(activity, 0);
  }

  clear(): void {
    this.m = 0;
    this.keys = [];
    this.position.clear();
    this.g.fill(0);
    this.changes = 0;
    this.borderBjdTdb = Number.NaN;
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
    this.scratchColumn = new Float64Array(cap);
    this.borderBjdTdb = Number.NaN;
  }

  /**
   * ā (kernel to the existing nights) in scratchA, b = P ā in scratchB; returns s = a − āᵀ b. ā, b and āᵀ b are
   * kept until the next commit: every slot of one night shares them.
   */
  private border(nightBjdTdb: number, weight: number): number {
    if (nightBjdTdb !== this.borderBjdTdb) {
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
      this.borderBjdTdb = nightBjdTdb;
      this.borderAb = ab;
    }
    return 1 / weight + this.tau2 + this.kernelAtZero - this.borderAb;
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
        addOuter(out, k * this.packed, this.p, this.d, 0, this.d, 0, 1 / s);
      }
      return;
    }
    const { d, x, p, h } = this;
    const w = v.weight;
    const after = nightWeight + sign * w;
    const pqq = this.pm[q * this.cap + q]!;
    for (let k = 0; k < this.samples; k++) {
      const at = k * this.packed;
      const hAt = q * this.row + k * p;
      if (after <= 1e-9 * w) {
        addOuter(out, at, p, h, hAt, h, hAt, -1 / pqq);
        continue;
      }
      const beta = this.meanChange(v, sign, nightWeight, nightU!, pqq, k);
      addOuter(out, at, p, h, hAt, d, 0, 1);
      addOuter(out, at, p, d, 0, h, hAt, 1);
      addOuter(out, at, p, d, 0, d, 0, pqq);
      for (let c = 0; c < p; c++) x[c] = h[hAt + c]! + pqq * d[c]!;
      addOuter(out, at, p, x, 0, x, 0, -beta);
    }
  }

  /**
   * For a change to existing night q that keeps some of its visits (P_qq = pqq): this.d = ū' − ū of sample k;
   * returns β.
   */
  private meanChange(v: InformationVisit, sign: 1 | -1, nightWeight: number, nightU: Float64Array, pqq: number, k: number): number {
    const { p, d } = this;
    const w = v.weight;
    const rows = v.rows;
    const from = v.offset + k * p;
    const after = nightWeight + sign * w;
    const delta = 1 / after - 1 / nightWeight;
    for (let c = 0; c < p; c++) d[c] = (nightU[k * p + c]! + sign * w * rows[from + c]!) / after - nightU[k * p + c]! / nightWeight;
    return delta / (1 + delta * pqq);
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
        const column = this.scratchColumn;
        for (let i = 0; i < this.m; i++) column[i] = this.pm[i * cap + q]!;
        const pqq = column[q]!;
        let betaUsed = 0;
        const { d, x, h } = this;
        for (let k = 0; k < this.samples; k++) {
          const beta = this.meanChange(v, sign, nightWeight, nightU!, pqq, k);
          betaUsed = beta;
          const hAt = q * row + k * p;
          for (let c = 0; c < p; c++) x[c] = d[c]! - beta * (h[hAt + c]! + pqq * d[c]!);
          for (let i = 0; i < this.m; i++) for (let c = 0; c < p; c++) h[i * row + k * p + c] += column[i]! * x[c]!;
          for (let c = 0; c < p; c++) this.ubar[q * row + k * p + c] += d[c]!;
        }
        for (let i = 0; i < this.m; i++) for (let k = 0; k < this.m; k++) this.pm[i * cap + k] -= betaUsed * column[i]! * column[k]!;
        this.weights[q] = after;
      }
    }
    this.borderBjdTdb = Number.NaN;
    if (++this.changes % REFRESH_EVERY === 0) this.refresh();
  }

  private addNight(v: InformationVisit): void {
    const { m, cap, p, row, pm } = this;
    const s = this.border(v.nightBjdTdb, v.weight);
    const b = this.scratchB;
    const rs = this.rs;
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
    const column = this.scratchColumn;
    for (let i = 0; i < m; i++) column[i] = pm[i * cap + q]!;
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
      for (let i = 0; i < m; i++) addOuter(this.g, s * this.packed, p, this.ubar, i * row + s * p, this.h, i * row + s * p, 1);
    }
  }
}

/**
 * out[at ..] (packed lower) += scale × x yᵀ with x and y the p entries of xs from xAt and of ys from yAt (only the
 * lower triangle of x yᵀ is read: add both orders for a symmetric sum).
 */
function addOuter(out: Float64Array, at: number, p: number, xs: Float64Array, xAt: number, ys: Float64Array, yAt: number, scale: number): void {
  let idx = at;
  for (let r = 0; r < p; r++) for (let c = 0; c <= r; c++) out[idx++] += scale * xs[xAt + r]! * ys[yAt + c]!;
}

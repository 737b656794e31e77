// The information on each planet's K that a star's visits give, kept up to date visit by visit
// (docs/references.md [Fisher-RV]). Nothing else in Crest computes information on K.
//
// Data model: y_i = j_iᵀθ + a_n(i) + e_i, with e_i white (photon noise, instrument floor and the
// white part of the jitter: weight w_i = 1/σ_i²) and a_n shared by every visit of night n (the
// nightly part of the jitter, τ², plus quasi-periodic activity across nights when the star has a
// rotation period). Split each night into its weighted mean and the residuals about it: the
// residuals carry Σ w (j − ū)(j − ū)ᵀ, free of a_n, and the means ȳ_n = ū_nᵀθ + a_n + ē_n
// (Var ē_n = 1/W_n) have covariance M = diag(1/W_n) + τ² I + K_activity. So
//   F = Λ + Σ_i w_i j_i j_iᵀ − Σ_n u_n u_nᵀ / W_n + Ūᵀ M⁻¹ Ū,   u_n = Σ_{i∈n} w_i j_i, ū_n = u_n / W_n,
// the Cramér–Rao bound of the linearised model with Gaussian priors Λ ([Kay1993] §3.9). Without
// activity M is diagonal and a night adds −τ²/(1 + τ² W_n) u_n u_nᵀ to Σ w j jᵀ (the Woodbury
// identity, [Golub-VanLoan2013] §2.1.4): adding or removing a visit costs O(p²) per sample. With
// activity M⁻¹ is kept explicitly and updated by bordering, rank-one and deletion formulas
// (correlated-nights.ts): O(m²) for the star's m observed nights, never a refactorisation.
//
// Var(K_k) = Σ_s w_s (F_s⁻¹)_kk over the model's sample ephemerides (information-model.ts).
import { CorrelatedNights } from './correlated-nights.js';
import { type StarModel, designRows, packedLength } from './information-model.js';
import { addRankTwoVariances, addTrailingVariances, addVariancesFromFactor, choleskyInPlace, type RankTwoScratch } from './packed-cholesky.js';

/** One visit as the information sees it. */
export interface InformationVisit {
  /** Design rows for every sample (designRows in information-model.ts), from `offset`. */
  rows: Float64Array;
  offset: number;
  /** 1/σ² of the visit's white noise, (m/s)⁻². */
  weight: number;
  /** Any integer naming the visit's night; visits of one night share the nightly noise. */
  night: number;
  /** A time (BJD_TDB) for the night, where the activity kernel is evaluated. */
  nightBjdTdb: number;
}

interface NightSums {
  weight: number;
  /** u = Σ w j, per sample. */
  u: Float64Array;
}

export class StarInformation {
  readonly sampleCount: number;
  readonly paramCount: number;
  readonly packed: number;
  readonly planetCount: number;
  /** Λ + Σ w j jᵀ − the nightly terms (all of F without activity; F − Ūᵀ M⁻¹ Ū with it), per sample. */
  private readonly base: Float64Array;
  private readonly nights = new Map<number, NightSums>();
  /** Night sums no longer in use, kept to spare the allocator (the optimiser adds and removes visits by the million). */
  private readonly spare: NightSums[] = [];
  private readonly tau2: number;
  private readonly correlated?: CorrelatedNights;
  private readonly work: Float64Array;
  private readonly uNew: Float64Array;
  private readonly delta: Float64Array;
  /** Per sample: the Cholesky factor of F and Var(K) as the visits stand, for rank-one trials; valid while !stale. */
  private readonly factor: Float64Array;
  private readonly factorOk: Uint8Array;
  private readonly current: Float64Array;
  private stale = true;
  private readonly scratch: RankTwoScratch;
  private readonly one: Float64Array;
  visitCount = 0;

  constructor(readonly model: StarModel) {
    this.sampleCount = model.samples.length;
    this.paramCount = model.paramCount;
    this.packed = packedLength(model.paramCount);
    this.planetCount = model.planetCount;
    this.base = new Float64Array(this.sampleCount * this.packed);
    this.reset();
    this.tau2 = model.input.nightlyJitterMps ** 2;
    if (model.input.activity) this.correlated = new CorrelatedNights(model.input.activity, this.tau2, this.sampleCount, this.paramCount);
    this.work = new Float64Array(this.packed);
    this.uNew = new Float64Array(this.paramCount);
    this.delta = new Float64Array(this.sampleCount * this.packed);
    this.factor = new Float64Array(this.sampleCount * this.packed);
    this.factorOk = new Uint8Array(this.sampleCount);
    this.current = new Float64Array(this.sampleCount * this.planetCount);
    this.scratch = { y1: new Float64Array(this.paramCount), y2: new Float64Array(this.paramCount) };
    this.one = new Float64Array(this.planetCount);
  }

  /** Factors F of every sample (without activity) and keeps each sample's Var(K). */
  private refactor(): void {
    const { packed, paramCount: p, planetCount } = this;
    const one = this.one;
    this.factor.set(this.base);
    for (let s = 0; s < this.sampleCount; s++) {
      this.factorOk[s] = choleskyInPlace(this.factor, p, s * packed) ? 1 : 0;
      if (!this.factorOk[s]) continue;
      one.fill(0);
      addVariancesFromFactor(this.factor, s * packed, p, planetCount, 1, one, this.scratch.y1);
      for (let k = 0; k < planetCount; k++) this.current[s * planetCount + k] = one[k]!;
    }
    this.stale = false;
  }

  /** Var(K) as the visits stand from the factors kept for trials (without activity); false when F is singular. */
  private currentVariances(out: Float64Array): boolean {
    if (this.stale) this.refactor();
    const { planetCount } = this;
    for (let s = 0; s < this.sampleCount; s++) if (!this.factorOk[s]) return false;
    for (let s = 0; s < this.sampleCount; s++) {
      const w = this.model.samples[s]!.weight;
      for (let k = 0; k < planetCount; k++) out[k] += w * this.current[s * planetCount + k]!;
    }
    return true;
  }

  /**
   * The fast path of `variances` without activity: adding visit v (weight w, row j) to a night
   * holding W and u changes F by w j jᵀ − c(W') u' u'ᵀ + c(W) u uᵀ with u' = u ± w j, which is
   * B M Bᵀ with B = [j u] and M = [[±w − c' w², ∓c' w], [∓c' w, c − c']] (c = c(W), c' = c(W')):
   * a rank-two change, priced from the factor of F (packed-cholesky.ts). False when the star has
   * activity or F is singular (then the general path refactors).
   */
  private lowRankVariances(out: Float64Array, v: InformationVisit, sign: 1 | -1): boolean {
    if (this.correlated) return false;
    if (this.stale) this.refactor();
    for (let s = 0; s < this.sampleCount; s++) if (!this.factorOk[s]) return false;
    const night = this.nights.get(v.night);
    const w = v.weight;
    const rows = v.rows;
    const offset = v.offset;
    const before = night?.weight ?? 0;
    const after = before + sign * w;
    const c0 = night ? this.coupling(before, w, false) : 0;
    const c1 = this.coupling(after, w, false);
    const m11 = sign * w - c1 * w * w;
    const m12 = night ? -sign * c1 * w : 0;
    const m22 = night ? c0 - c1 : 0;
    const { packed, paramCount: p, planetCount } = this;
    const u = night?.u ?? rows;
    for (let s = 0; s < this.sampleCount; s++) {
      const ok = addRankTwoVariances(
        this.factor,
        s * packed,
        p,
        planetCount,
        this.current,
        s * planetCount,
        rows,
        offset + s * p,
        u,
        night ? s * p : 0,
        m11,
        m12,
        m22,
        this.scratch,
        this.model.samples[s]!.weight,
        out,
      );
      if (!ok) {
        out.fill(0);
        return false;
      }
    }
    return true;
  }

  private reset(): void {
    for (let s = 0; s < this.sampleCount; s++) this.base.set(this.model.priorPrecision, s * this.packed);
  }

  /** Var(K) of each planet (out, length planetCount), with visit v added (sign 1), removed (-1), or as it is (v undefined). */
  variances(out: Float64Array, v?: InformationVisit, sign: 1 | -1 = 1): Float64Array {
    out.fill(0);
    // γ and the K's have no prior: fewer visits than 1 + planets leave the K's undetermined.
    if (this.visitCount + (v ? sign : 0) < 1 + this.planetCount) return out.fill(Infinity);
    if (v && this.lowRankVariances(out, v, sign)) return out;
    if (!v && !this.correlated && this.currentVariances(out)) return out;
    if (v) this.deltas(v, sign, true);
    const { packed, paramCount: p, planetCount } = this;
    for (let s = 0; s < this.sampleCount; s++) {
      const at = s * packed;
      for (let i = 0; i < packed; i++) this.work[i] = this.base[at + i]! + (v ? this.delta[at + i]! : 0);
      if (this.correlated) this.correlated.addTo(this.work, s);
      addTrailingVariances(this.work, p, planetCount, this.model.samples[s]!.weight, out, this.scratch.y1);
    }
    return out;
  }

  /** Adds (sign 1) or removes (-1) visit v. */
  apply(v: InformationVisit, sign: 1 | -1): void {
    this.deltas(v, sign, false);
    this.stale = true;
    const { base, delta } = this;
    for (let i = 0; i < base.length; i++) base[i] += delta[i]!;
    const night = this.nights.get(v.night);
    const p = this.paramCount;
    const w = v.weight;
    const rows = v.rows;
    const offset = v.offset;
    if (this.correlated) this.correlated.commit(v, sign, night?.weight ?? 0, night?.u);
    if (night) {
      night.weight += sign * w;
      for (let i = 0; i < night.u.length; i++) night.u[i] += sign * w * rows[offset + i]!;
      if (night.weight <= 1e-9 * w) {
        this.nights.delete(v.night);
        this.spare.push(night);
      }
    } else {
      if (sign < 0) throw new Error('information: removing a visit from a night without visits');
      const sums = this.spare.pop() ?? { weight: 0, u: new Float64Array(this.sampleCount * p) };
      sums.weight = w;
      for (let i = 0; i < sums.u.length; i++) sums.u[i] = w * rows[offset + i]!;
      this.nights.set(v.night, sums);
    }
    this.visitCount += sign;
    // No visits left: back to the prior exactly, free of the rounding residue of the removals.
    if (this.visitCount === 0) this.clear();
  }

  /** c(W) of the nightly terms: τ²/(1 + τ² W) without activity, 1/W with it; 0 for an empty night (W ≈ 0 against a visit's weight w). */
  private coupling(weight: number, w: number, correlated: boolean): number {
    if (weight <= 1e-9 * w) return 0;
    return correlated ? 1 / weight : this.tau2 / (1 + this.tau2 * weight);
  }

  /** Forgets every visit. */
  clear(): void {
    this.visitCount = 0;
    this.stale = true;
    this.reset();
    for (const night of this.nights.values()) this.spare.push(night);
    this.nights.clear();
    this.correlated?.clear();
  }

  /**
   * this.delta ← the change of `base` when v is added or removed: sign w j jᵀ − c(W') u' u'ᵀ +
   * c(W) u uᵀ with c(W) = τ²/(1 + τ²W) without activity (the Woodbury form above), or
   * c(W) = 1/W with it (the nightly means then move into the correlated part, whose change is
   * added too when `withCorrelated`).
   */
  private deltas(v: InformationVisit, sign: 1 | -1, withCorrelated: boolean): void {
    const { packed, paramCount: p, delta, uNew } = this;
    const night = this.nights.get(v.night);
    // The visit's fields read once: a visit may compute them (the scheduler's SlotVisit).
    const w = v.weight;
    const rows = v.rows;
    const offset = v.offset;
    const before = night?.weight ?? 0;
    const after = before + sign * w;
    const cBefore = this.coupling(before, w, this.correlated !== undefined);
    const cAfter = this.coupling(after, w, this.correlated !== undefined);
    for (let s = 0; s < this.sampleCount; s++) {
      const j = s * p;
      const row = offset + j;
      const at = s * packed;
      for (let r = 0; r < p; r++) uNew[r] = (night ? night.u[j + r]! : 0) + sign * w * rows[row + r]!;
      let idx = at;
      for (let r = 0; r < p; r++) {
        const jr = rows[row + r]!;
        const ur = night ? night.u[j + r]! : 0;
        for (let c = 0; c <= r; c++) {
          const uc = night ? night.u[j + c]! : 0;
          delta[idx++] = sign * w * jr * rows[row + c]! - cAfter * uNew[r]! * uNew[c]! + cBefore * ur * uc;
        }
      }
    }
    if (withCorrelated && this.correlated) this.correlated.addDelta(v, sign, before, night?.u, delta);
  }
}

/** Var(K) of each planet for a set of visits, from a fresh accumulator. */
export function kVariances(model: StarModel, visits: InformationVisit[]): Float64Array {
  const info = new StarInformation(model);
  for (const v of visits) info.apply(v, 1);
  return info.variances(new Float64Array(model.planetCount));
}

/** The visits of one star as the information sees them: design rows at each time, one night key per visit. */
export function informationVisits(
  model: StarModel,
  visits: { bjdTdb: number; whiteSigmaMps: number; night: number; nightBjdTdb: number }[],
): InformationVisit[] {
  return visits.map((v) => ({
    rows: designRows(model, v.bjdTdb),
    offset: 0,
    weight: 1 / (v.whiteSigmaMps * v.whiteSigmaMps),
    night: v.night,
    nightBjdTdb: v.nightBjdTdb,
  }));
}

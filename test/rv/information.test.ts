import { describe, expect, it } from 'vitest';
import { activityCovariance } from '../../src/rv/activity-kernel.js';
import { type PlanetInput, type StarInput, buildStarModel } from '../../src/rv/information-model.js';
import { StarInformation, informationVisits, kVariances } from '../../src/rv/information.js';
import { type Rng, createRng } from '../../src/rv/random.js';
import { type DenseVisit, denseKVariances } from '../support/dense-information.js';

const BJD0 = 2460400.5;

const between = (rng: Rng, lo: number, hi: number) => lo + (hi - lo) * rng.uniform();

/** A random planet: circular or eccentric (e < 0.6), e fitted or not, a fresh, stale, period-only or exactly known ephemeris. */
function randomPlanet(rng: Rng, id: string, span: [number, number]): PlanetInput {
  const periodDays = Math.exp(between(rng, Math.log(1.5), Math.log(60)));
  const ecc = rng.uniform() < 0.4 ? 0 : between(rng, 0.02, 0.6);
  const kind = rng.uniform();
  let tcBjdTdb: number;
  let tcErrDays: number;
  let periodErrDays: number;
  if (kind < 0.35) {
    // Fresh: a transit inside the span, small errors.
    tcBjdTdb = between(rng, span[0], span[1]);
    tcErrDays = between(rng, 0.0005, 0.005) * periodDays;
    periodErrDays = between(rng, 1e-6, 1e-5) * periodDays;
  } else if (kind < 0.8) {
    // Stale: measured years before, phase errors up to ~0.3 cycles by the span.
    tcBjdTdb = span[0] - between(rng, 500, 3000);
    tcErrDays = between(rng, 0.001, 0.01) * periodDays;
    const epochs = (span[1] - tcBjdTdb) / periodDays;
    periodErrDays = (between(rng, 0.02, 0.3) * periodDays) / epochs;
  } else if (kind < 0.9) {
    tcBjdTdb = span[0] - between(rng, 0, 500);
    tcErrDays = between(rng, 0.001, 0.05) * periodDays;
    periodErrDays = 0;
  } else {
    tcBjdTdb = span[0] - between(rng, 0, 500);
    tcErrDays = 0;
    periodErrDays = 0;
  }
  const planet: PlanetInput = { id, kMps: between(rng, 2, 20), periodDays, tcBjdTdb, periodErrDays, tcErrDays, ecc, omegaDeg: between(rng, 0, 360) };
  if (rng.uniform() < 0.5) planet.eccPriorSigma = between(rng, 0.03, 0.2);
  return planet;
}

function randomStar(rng: Rng, planets: number, opts: { jitter: boolean; activity: boolean }): StarInput {
  const start = BJD0 + between(rng, 0, 100);
  const span: [number, number] = [start, start + between(rng, 60, 200)];
  const star: StarInput = {
    planets: Array.from({ length: planets }, (_, i) => randomPlanet(rng, `p${i}`, span)),
    nightlyJitterMps: opts.jitter ? between(rng, 0.5, 4) : 0,
    spanBjdTdb: span,
  };
  if (opts.activity) star.activity = { amplitudeMps: between(rng, 1, 5), rotationDays: between(rng, 8, 40), coherenceDays: between(rng, 15, 60) };
  return star;
}

/** count visits on distinct-or-shared nights within the span; about a third of the nights get 2–4 visits. */
function randomVisits(rng: Rng, star: StarInput, count: number): DenseVisit[] {
  const [start, end] = star.spanBjdTdb;
  const visits: DenseVisit[] = [];
  const usedNights = new Set<number>();
  while (visits.length < count) {
    let night = Math.floor(between(rng, start, end - 0.3) - BJD0);
    while (usedNights.has(night)) night = Math.floor(between(rng, start, end - 0.3) - BJD0);
    usedNights.add(night);
    const nightBjdTdb = BJD0 + night + 0.2;
    const n = rng.uniform() < 0.35 ? 2 + Math.floor(rng.uniform() * 3) : 1;
    for (let k = 0; k < n && visits.length < count; k++) {
      visits.push({ bjdTdb: nightBjdTdb + between(rng, -0.15, 0.15), whiteSigmaMps: between(rng, 1, 5), night, nightBjdTdb });
    }
  }
  return visits;
}

function relDiff(a: number, b: number): number {
  if (a === b) return 0;
  return Math.abs(a - b) / Math.max(Math.abs(a), Math.abs(b));
}

/** Asserts agreement to `rel`; returns the largest relative difference seen. */
function expectClose(actual: ArrayLike<number>, expected: ArrayLike<number>, rel: number, label: string): number {
  expect(actual.length).toBe(expected.length);
  let worst = 0;
  for (let i = 0; i < expected.length; i++) {
    expect(Number.isFinite(expected[i]), `${label}: reference finite`).toBe(true);
    const d = relDiff(actual[i]!, expected[i]!);
    expect(d, `${label}: planet ${i}: module ${actual[i]} vs reference ${expected[i]}`).toBeLessThan(rel);
    worst = Math.max(worst, d);
  }
  return worst;
}

describe('StarInformation against a dense Cramér–Rao reference (test/support/dense-information.ts)', () => {
  const configs = [
    { planets: 1, jitter: false, activity: false },
    { planets: 1, jitter: true, activity: false },
    { planets: 1, jitter: true, activity: true },
    { planets: 2, jitter: false, activity: false },
    { planets: 2, jitter: true, activity: false },
    { planets: 2, jitter: false, activity: true },
    { planets: 2, jitter: true, activity: true },
  ];
  for (const [c, config] of configs.entries()) {
    it(`${config.planets} planet(s), jitter ${config.jitter}, activity ${config.activity}: 12 random stars agree to 1e-6`, () => {
      const rng = createRng(1000 + c);
      let worst = 0;
      for (let trial = 0; trial < 12; trial++) {
        const star = randomStar(rng, config.planets, config);
        const visits = randomVisits(rng, star, 5 + Math.floor(rng.uniform() * 26));
        const model = buildStarModel(star);
        const claimed = kVariances(model, informationVisits(model, visits));
        worst = Math.max(worst, expectClose(claimed, denseKVariances(model, visits), 1e-6, `trial ${trial}`));
      }
      console.log(`dense reference, ${JSON.stringify(config)}: largest relative difference ${worst.toExponential(2)}`);
    });
  }
});

/** A star with one circular planet whose ephemeris is exactly known: only γ and K are fitted. */
function knownPlanetStar(nightlyJitterMps: number, activity?: StarInput['activity']): StarInput {
  const planet: PlanetInput = { id: 'b', kMps: 7, periodDays: 5, tcBjdTdb: BJD0, periodErrDays: 0, tcErrDays: 0, ecc: 0, omegaDeg: 90 };
  const star: StarInput = { planets: [planet], nightlyJitterMps, spanBjdTdb: [BJD0, BJD0 + 100] };
  if (activity) star.activity = activity;
  return star;
}

/** n visits of σ at one instant on each of two nights, at the quadratures φ = 0.75 (s = +1) and φ = 0.25 (s = −1). */
function quadratureVisits(nA: number, sigmaA: number, nB: number, sigmaB: number): DenseVisit[] {
  const tA = BJD0 + 10 * 5 + 0.75 * 5;
  const tB = BJD0 + 14 * 5 + 0.25 * 5;
  return [
    ...Array.from({ length: nA }, () => ({ bjdTdb: tA, whiteSigmaMps: sigmaA, night: 1, nightBjdTdb: tA })),
    ...Array.from({ length: nB }, () => ({ bjdTdb: tB, whiteSigmaMps: sigmaB, night: 2, nightBjdTdb: tB })),
  ];
}

describe('analytic cases', () => {
  // With the ephemeris known, v = γ + K s, s = −sin 2πφ (circular, ω = 90°). Night A (s = +1)
  // and night B (s = −1) each reduce to their mean, ȳ = γ ± K + a_night + ē with variance
  // V = σ²/n + τ² (+ h² with activity), and the two means share the activity covariance k(Δt).
  // The residuals about each mean carry nothing on γ or K (the design rows are equal), so
  // K̂ = (ȳ_A − ȳ_B)/2 and Var(K) = (V_A + V_B − 2 k(Δt)) / 4 (derived here, common practice
  // for the difference of two correlated means).
  const analytic = (vA: number, vB: number, kAB = 0) => (vA + vB - 2 * kAB) / 4;

  it('no visits or one visit: K is not determined (Infinity)', () => {
    const model = buildStarModel(randomStar(createRng(7), 1, { jitter: true, activity: false }));
    expect(kVariances(model, [])[0]).toBe(Infinity);
    const one = informationVisits(model, [{ bjdTdb: model.input.spanBjdTdb[0] + 3.3, whiteSigmaMps: 2, night: 3, nightBjdTdb: model.input.spanBjdTdb[0] + 3 }]);
    // One number cannot separate γ from K.
    expect(kVariances(model, one)[0]).toBe(Infinity);
    const two = buildStarModel({ ...model.input, planets: [model.input.planets[0]!, { ...model.input.planets[0]!, id: 'c', periodDays: 13.1 }] });
    expect(
      Array.from(
        kVariances(
          two,
          informationVisits(two, [{ bjdTdb: two.input.spanBjdTdb[0] + 3.3, whiteSigmaMps: 2, night: 3, nightBjdTdb: two.input.spanBjdTdb[0] + 3 }]),
        ),
      ),
    ).toEqual([Infinity, Infinity]);
  });

  it('one visit per quadrature, white noise only: Var(K) = σ²/2', () => {
    const model = buildStarModel(knownPlanetStar(0));
    const got = kVariances(model, informationVisits(model, quadratureVisits(1, 3, 1, 3)))[0]!;
    expect(relDiff(got, 9 / 2)).toBeLessThan(1e-10);
  });

  it('13 visits in one night with shared τ² gain no more than one visit of the same total weight plus τ²', () => {
    const sigma = 4;
    const tau = 2.5;
    const model = buildStarModel(knownPlanetStar(tau));
    const many = kVariances(model, informationVisits(model, quadratureVisits(13, sigma, 1, 3)))[0]!;
    const expected = analytic((sigma * sigma) / 13 + tau * tau, 9 + tau * tau);
    expect(relDiff(many, expected)).toBeLessThan(1e-10);
    // Without the nightly term, the same 13 visits would be worth (σ²/13 + 9)/4; with it the
    // floor τ² remains however many visits the night gets: 1,000 visits are barely better.
    const thousand = kVariances(model, informationVisits(model, quadratureVisits(1000, sigma, 1, 3)))[0]!;
    expect(relDiff(thousand, analytic((sigma * sigma) / 1000 + tau * tau, 9 + tau * tau))).toBeLessThan(1e-9);
    expect(thousand).toBeGreaterThan((2 * tau * tau + 9) / 4);
  });

  it('two nights of n visits at opposite quadratures: Var(K) = (σ²/n + τ²)/2, for n = 1..6', () => {
    const sigma = 3;
    const tau = 1.7;
    const model = buildStarModel(knownPlanetStar(tau));
    for (let n = 1; n <= 6; n++) {
      const got = kVariances(model, informationVisits(model, quadratureVisits(n, sigma, n, sigma)))[0]!;
      expect(relDiff(got, ((sigma * sigma) / n + tau * tau) / 2)).toBeLessThan(1e-10);
    }
  });

  it('unequal σ within a night: the night counts with W = Σ 1/σ²', () => {
    const tau = 1.2;
    const model = buildStarModel(knownPlanetStar(tau));
    const visits = quadratureVisits(3, 2, 2, 5);
    visits[1]!.whiteSigmaMps = 3;
    visits[2]!.whiteSigmaMps = 6;
    const wA = 1 / 4 + 1 / 9 + 1 / 36;
    const got = kVariances(model, informationVisits(model, visits))[0]!;
    expect(relDiff(got, analytic(1 / wA + tau * tau, 25 / 2 + tau * tau))).toBeLessThan(1e-10);
  });

  it('with activity: the two night means also share h² and k(Δt)', () => {
    const tau = 1.1;
    const activity = { amplitudeMps: 3, rotationDays: 23, coherenceDays: 40 };
    const model = buildStarModel(knownPlanetStar(tau, activity));
    const visits = quadratureVisits(4, 2.5, 3, 3.5);
    const dt = visits[0]!.nightBjdTdb - visits[visits.length - 1]!.nightBjdTdb;
    // k(Δt) = h² exp(−Δt²/2λ² − sin²(πΔt/P_rot)/(2 · 0.5²)) written out here (Haywood et al. 2014 form).
    const h2 = 9;
    const kAB = h2 * Math.exp(-(dt * dt) / (2 * 40 * 40) - 2 * Math.sin((Math.PI * dt) / 23) ** 2);
    expect(relDiff(activityCovariance(activity, dt), kAB)).toBeLessThan(1e-12);
    const got = kVariances(model, informationVisits(model, visits))[0]!;
    expect(relDiff(got, analytic(6.25 / 4 + tau * tau + h2, 12.25 / 3 + tau * tau + h2, kAB))).toBeLessThan(1e-9);
  });
});

/** Runs a random sequence of adds and removes over a pool of visits, checking as it goes. */
function churn(star: StarInput, seed: number, steps: number): { changes: number; worstFresh: number; worstTrial: number; worstDense: number } {
  const rng = createRng(seed);
  const model = buildStarModel(star);
  const pool = randomVisits(rng, star, 40);
  const rows = informationVisits(model, pool);
  const active = new Set<number>();
  const info = new StarInformation(model);
  const out = new Float64Array(model.planetCount);
  const trial = new Float64Array(model.planetCount);
  let changes = 0;
  let worstFresh = 0;
  let worstTrial = 0;
  let worstDense = 0;
  const compare = (a: ArrayLike<number>, b: ArrayLike<number>) => {
    let worst = 0;
    for (let i = 0; i < a.length; i++) worst = Math.max(worst, relDiff(a[i]!, b[i]!));
    return worst;
  };
  for (let step = 0; step < steps; step++) {
    const add = active.size === 0 || (active.size < pool.length && rng.uniform() < 0.6);
    let v: number;
    if (add) {
      const free = pool.map((_, i) => i).filter((i) => !active.has(i));
      v = free[Math.floor(rng.uniform() * free.length)]!;
    } else {
      const on = [...active];
      v = on[Math.floor(rng.uniform() * on.length)]!;
    }
    const sign = add ? 1 : -1;
    info.variances(trial, rows[v]!, sign);
    info.apply(rows[v]!, sign);
    changes++;
    if (add) active.add(v);
    else active.delete(v);
    info.variances(out);
    worstTrial = Math.max(worstTrial, compare(trial, out));
    const remaining = [...active].sort((a, b) => a - b);
    const fresh = kVariances(
      model,
      remaining.map((i) => rows[i]!),
    );
    worstFresh = Math.max(worstFresh, compare(out, fresh));
    if (step % 10 === 9 && remaining.length >= 4)
      worstDense = Math.max(
        worstDense,
        compare(
          out,
          denseKVariances(
            model,
            remaining.map((i) => pool[i]!),
          ),
        ),
      );
  }
  return { changes, worstFresh, worstTrial, worstDense };
}

describe('incremental updates', () => {
  const cases: [string, { planets: number; jitter: boolean; activity: boolean }][] = [
    ['white noise only', { planets: 1, jitter: false, activity: false }],
    ['nightly jitter', { planets: 2, jitter: true, activity: false }],
    ['activity, more than 64 changes (the correlated part is refreshed)', { planets: 1, jitter: true, activity: true }],
    ['activity, two planets, 200 changes', { planets: 2, jitter: false, activity: true }],
  ];
  for (const [c, [name, config]] of cases.entries()) {
    it(`${name}: adds and removes equal a fresh accumulation; the trial form equals applying`, () => {
      const star = randomStar(createRng(500 + c), config.planets, config);
      const r = churn(star, 900 + c, config.activity ? 200 : 120);
      console.log(
        `incremental, ${name}: ${r.changes} changes; vs fresh ${r.worstFresh.toExponential(2)}, ` +
          `trial vs apply ${r.worstTrial.toExponential(2)}, vs dense ${r.worstDense.toExponential(2)}`,
      );
      if (config.activity) expect(r.changes).toBeGreaterThan(64);
      expect(r.worstFresh).toBeLessThan(1e-8);
      expect(r.worstTrial).toBeLessThan(1e-8);
      expect(r.worstDense).toBeLessThan(1e-6);
    });
  }
});

describe('model layout read by the dense reference', () => {
  it('Tc_ref is the predicted transit nearest mid-span; U the orbits to the farther end', () => {
    const rng = createRng(77);
    for (let trial = 0; trial < 20; trial++) {
      const star = randomStar(rng, 2, { jitter: false, activity: false });
      const model = buildStarModel(star);
      const mid = (star.spanBjdTdb[0] + star.spanBjdTdb[1]) / 2;
      star.planets.forEach((pl, i) => {
        const ref = model.planets[i]!.tcRefBjdTdb;
        const epochs = (ref - pl.tcBjdTdb) / pl.periodDays;
        expect(Math.abs(epochs - Math.round(epochs))).toBeLessThan(1e-6);
        expect(Math.abs(ref - mid)).toBeLessThanOrEqual(pl.periodDays / 2 + 1e-6);
        const u = Math.max(1, (ref - star.spanBjdTdb[0]) / pl.periodDays, (star.spanBjdTdb[1] - ref) / pl.periodDays);
        expect(relDiff(model.planets[i]!.orbitsScale, u)).toBeLessThan(1e-12);
      });
    }
  });

  it('the sample ephemerides reproduce the prior covariance of (α, β) (sigma points match second moments)', () => {
    // Catalogue transit 150 d before the span, σ_Tc = 0.05 P, σ_P = 0.02 d: both directions of
    // (α, β) exceed the 0.01-cycle sampling threshold. Cov from Tc_ref = Tc + n P (common practice): Var δTc_ref =
    // σ_Tc² + n² σ_P², Cov(δTc_ref, δP) = n σ_P²; α = δTc_ref / P, β = δP U / P.
    const span: [number, number] = [BJD0, BJD0 + 90];
    const pl: PlanetInput = { id: 'b', kMps: 5, periodDays: 6.2, tcBjdTdb: BJD0 - 150, tcErrDays: 0.31, periodErrDays: 0.02, ecc: 0, omegaDeg: 90 };
    const model = buildStarModel({ planets: [pl], nightlyJitterMps: 0, spanBjdTdb: span });
    const n = Math.round((model.planets[0]!.tcRefBjdTdb - pl.tcBjdTdb) / pl.periodDays);
    const u = model.planets[0]!.orbitsScale;
    const P = pl.periodDays;
    const aa = (pl.tcErrDays ** 2 + n * n * pl.periodErrDays ** 2) / P ** 2;
    const ab = (n * pl.periodErrDays ** 2 * u) / P ** 2;
    const bb = (pl.periodErrDays * u) ** 2 / P ** 2;
    const m = { w: 0, a: 0, b: 0, aa: 0, ab: 0, bb: 0 };
    for (const s of model.samples) {
      const [a, b] = [s.alpha[0]!, s.beta[0]!];
      m.w += s.weight;
      m.a += s.weight * a;
      m.b += s.weight * b;
      m.aa += s.weight * a * a;
      m.ab += s.weight * a * b;
      m.bb += s.weight * b * b;
    }
    expect(m.w).toBeCloseTo(1, 12);
    expect(Math.abs(m.a)).toBeLessThan(1e-12);
    expect(Math.abs(m.b)).toBeLessThan(1e-12);
    expect(relDiff(m.aa, aa)).toBeLessThan(1e-10);
    expect(relDiff(m.ab, ab)).toBeLessThan(1e-10);
    expect(relDiff(m.bb, bb)).toBeLessThan(1e-10);
  });

  it('an exactly known Tc with an uncertain period agrees with the dense reference', () => {
    const rng = createRng(88);
    const star = randomStar(rng, 1, { jitter: true, activity: false });
    star.planets[0] = { ...star.planets[0]!, tcErrDays: 0, periodErrDays: 1e-4 * star.planets[0]!.periodDays };
    const model = buildStarModel(star);
    const visits = randomVisits(rng, star, 15);
    expectClose(kVariances(model, informationVisits(model, visits)), denseKVariances(model, visits), 1e-6, 'known Tc');
  });
});

import { describe, expect, it } from 'vitest';
import { activityJitterMps, defaultJitter, oscillationJitterMps, quietJitterMps, rotationJitterMps } from '../../src/rv/jitter.js';

describe('default jitter from the star (each relation with its published figure)', () => {
  it('quiet level by Teff: 1.5 m/s G/K, 2 m/s M, rising to 5 m/s at 7000 K (after [Wright2005], from memory)', () => {
    expect(quietJitterMps(5500)).toBe(1.5);
    expect(quietJitterMps(3500)).toBe(2);
    expect(quietJitterMps(7000)).toBe(5);
  });

  it('a G star at v sin i 8-10 km/s: 20-45 m/s ([Saar1998], abstract); proportional to v sin i in G/K', () => {
    for (const vsini of [8, 9, 10]) {
      const j = defaultJitter({ teffK: 5800, vsiniKms: vsini }).jitterMps;
      expect(j).toBeGreaterThanOrEqual(20);
      expect(j).toBeLessThanOrEqual(45);
    }
    expect(rotationJitterMps(5000, 16) / rotationJitterMps(5000, 8)).toBeCloseTo(2, 12);
    expect(rotationJitterMps(6300, 16) / rotationJitterMps(6300, 8)).toBeCloseTo(2 ** 1.3, 12); // F stars: (v sin i)^1.3
  });

  it('an unresolved or defaulted v sin i adds nothing: the quiet level stays', () => {
    expect(defaultJitter({ teffK: 5800, vsiniKms: 2 }).jitterMps).toBe(1.5);
    expect(defaultJitter({ teffK: 5800 }).jitterMps).toBe(1.5);
  });

  it("activity: nothing at the quiet log R'HK, rising with it; an active G dwarf at -4.4 gets ~10-20 m/s ([Santos2000] relation)", () => {
    expect(activityJitterMps(5800, -4.95)).toBe(0);
    expect(activityJitterMps(5800, -4.6)).toBeGreaterThan(activityJitterMps(5800, -4.8));
    const active = defaultJitter({ teffK: 5800, logRhk: -4.4 }).jitterMps;
    expect(active).toBeGreaterThan(10);
    expect(active).toBeLessThan(20);
  });

  it('oscillations from log g: the Sun 0.23 m/s, a red giant (log g 2.5, 4800 K) several m/s ([KjeldsenBedding1995])', () => {
    expect(oscillationJitterMps(5772, Math.log10(27400))).toBeCloseTo(0.234, 3);
    const giant = oscillationJitterMps(4800, 2.5);
    expect(giant).toBeGreaterThan(5);
    expect(giant).toBeLessThan(20);
  });

  it('says where the value came from', () => {
    const j = defaultJitter({ teffK: 5200, vsiniKms: 6, logRhk: -4.5, logg: 3.9 });
    const terms = [
      String.raw`quiet \[Wright2005\] 1\.50`,
      String.raw`rotation \[Saar1998\] [\d.]+`,
      String.raw`activity log R'HK \[Santos2000\] [\d.]+`,
      String.raw`oscillations log g \[KjeldsenBedding1995\] [\d.]+`,
    ];
    expect(j.source).toMatch(new RegExp(terms.join(String.raw` \+ `)));
    const parts = [...j.source.matchAll(/ ([\d.]+)(?= \+|$)/g)].map((m) => Number(m[1]));
    expect(j.jitterMps).toBeCloseTo(Math.hypot(...parts), 1);
  });
});

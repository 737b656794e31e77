// The fast windows against the slow one-minute reference sampler on 500 random target/site/date
// cases (seeded): both hemispheres, latitudes to 70 deg, circumpolar and never-rising stars, horizon
// masks, hour-angle limits and Moon limits. Edges must agree within 2 minutes (the reference's
// one-minute grid accounts for up to 1 of them).
import { describe, expect, it } from 'vitest';
import type { Constraints, Site, Target, TwilightLevel } from '../../src/model.js';
import { createRng } from '../../src/rv/random.js';
import { computeNight } from '../../src/sky/nights.js';
import { compareWithReference, referenceWindows, type ReferenceWindow } from '../../reference/sky-sampler.js';
import { computeWindows } from '../../src/sky/visibility.js';
import type { Window } from '../../src/model.js';

const GROUPS = 100;
const TARGETS_PER_GROUP = 5;
const rng = createRng(20270301);
const between = (lo: number, hi: number) => lo + (hi - lo) * rng.uniform();
const pick = <T>(items: readonly T[]) => items[Math.floor(rng.uniform() * items.length)]!;

function randomSite(i: number): Site {
  const latitudeDeg = between(-70, 70);
  const longitudeDeg = between(-180, 180);
  const hours = Math.round(longitudeDeg / 15);
  const masked = rng.uniform() < 0.25;
  const site: Site = {
    id: `random-${i}`,
    name: 'random',
    latitudeDeg,
    longitudeDeg,
    elevationM: between(0, 4000),
    timeZone: hours === 0 ? 'UTC' : `Etc/GMT${hours > 0 ? '-' : '+'}${Math.abs(hours)}`,
    minAltitudeDeg: between(0, 30),
    clearFraction: 1,
    sourceNote: 'random test site',
    file: 'random',
  };
  if (masked) {
    site.horizon = [0, 70, 150, 220, 300].map((azimuthDeg) => ({ azimuthDeg: azimuthDeg + between(0, 40), altitudeDeg: between(0, 35) }));
    site.hourAngleLimitsHours = { east: -between(2, 6), west: between(2, 6) };
  }
  return site;
}

function star(id: string, decDeg: number): Target {
  return {
    id,
    starId: id,
    raDeg: between(0, 360),
    decDeg,
    pmRaMasYr: 300 * rng.normal(),
    pmDecMasYr: 300 * rng.normal(),
    epochYear: 2016,
    vmag: 9,
    teffK: 5500,
    massSun: 1,
    vsiniKms: 2,
    jitterMps: 1.5,
    priority: 1,
    estimated: [],
    source: 'random',
  };
}

describe('computeWindows against the one-minute reference sampler', () => {
  it(`${GROUPS * TARGETS_PER_GROUP} random cases: every edge within 2 minutes`, () => {
    const fast: Window[] = [];
    const reference: ReferenceWindow[] = [];
    let circumpolar = 0;
    let neverUp = 0;
    for (let g = 0; g < GROUPS; g++) {
      const site = randomSite(g);
      const day = new Date(Date.UTC(2024, 0, 1) + Math.floor(between(0, 365 * 6)) * 86_400_000).toISOString().slice(0, 10);
      const twilight = pick<TwilightLevel>(['civil', 'nautical', 'astronomical']);
      const constraints: Constraints = {
        twilight,
        maxAirmass: between(1.3, 3),
        moonSeparationDeg: pick([0, 30, 60]),
        minSpacingHours: 0,
        sameNightSpacingHours: 0,
        minWindowMinutes: 0,
      };
      const hemisphere = Math.sign(site.latitudeDeg);
      const targets = [
        star(`g${g}-circumpolar`, hemisphere * between(75, 89.5)),
        star(`g${g}-south-of-sky`, -hemisphere * between(70, 89.5)),
        ...Array.from({ length: TARGETS_PER_GROUP - 2 }, (_, k) => star(`g${g}-t${k}`, (Math.asin(between(-1, 1)) * 180) / Math.PI)),
      ];
      const night = computeNight(site, day, twilight);
      const result = computeWindows(site, targets, [night], constraints);
      fast.push(...result.windows);
      reference.push(...referenceWindows(site, targets, night, constraints));
      circumpolar += result.windows.filter(
        (w) => w.targetId.endsWith('circumpolar') && w.start.getTime() === night.darkStart!.getTime() && w.end.getTime() === night.darkEnd!.getTime(),
      ).length;
      neverUp += result.dropped.filter((d) => d.cause === 'never rises' || d.cause === 'too low').length;
    }
    const comparison = compareWithReference(fast, reference);
    // The sample covers what it should: windows, whole-night (circumpolar) windows, never-rising stars.
    expect(comparison.matched).toBeGreaterThan(150);
    expect(circumpolar).toBeGreaterThan(10);
    expect(neverUp).toBeGreaterThan(20);
    expect(comparison.unmatched.filter((u) => u.minutes >= 1)).toEqual([]);
    expect(comparison.maxEdgeErrorMin).toBeLessThan(2);
  });
});

// Plan warnings on an invented campaign at a southern site (test/fixtures/campaigns/warnings): a
// star at +80 deg never rises there, and a period known only to 0.02 d loses the phase by the
// window's end; a well-known ephemeris gets neither warning.
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Body, Equator, MakeTime, Observer } from 'astronomy-engine';
import { DateTime } from 'luxon';
import { beforeAll, describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { visitPrecision } from '../../src/rv/precision.js';
import type { Campaign } from '../../src/plan/campaign.js';
import type { Plan } from '../../src/plan/plan-schema.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { referenceWindows } from '../../reference/sky-sampler.js';
import { DEMO_CAMPAIGN } from '../../src/io/paths.js';
import { fixture } from './fixtures.js';

let campaign: Campaign;
let plan: Plan;
beforeAll(() => {
  campaign = readCampaign(fixture('warnings'));
  plan = buildPlan(campaign, { weatherTrials: 10 });
});

const warningsOf = (id: string) => plan.targets.find((t) => t.targetId === id)!.warnings;

describe('never observable', () => {
  it('a star at +80 deg seen from 29 deg south: no reference window on any night, and the warning', () => {
    const polar = campaign.targets.find((t) => t.id === 'Polar-7')!;
    // Highest altitude of a star: 90 - |latitude - declination| (common practice), below the horizon here.
    expect(90 - Math.abs(campaign.site.latitudeDeg - polar.decDeg)).toBeLessThan(0);
    for (const night of plan.nights) expect(referenceWindows(campaign.site, [polar], night, campaign.constraints)).toEqual([]);
    expect(warningsOf('Polar-7').some((w) => w.includes('never observable'))).toBe(true);
    expect(plan.visits.some((v) => v.starId === 'Polar-7')).toBe(false);
  });

  it('says it never rises, by how much, and nothing of what its exposures would cost', () => {
    const polar = campaign.targets.find((t) => t.id === 'Polar-7')!;
    const belowDeg = Math.abs(90 - Math.abs(campaign.site.latitudeDeg - polar.decDeg));
    const [warning, ...others] = warningsOf('Polar-7');
    expect(others).toEqual([]);
    const m = /^never observable in the window: never rises at this site \(culminates ([\d.]+) deg below the horizon\)$/.exec(warning!);
    expect(m, warning).not.toBeNull();
    // Precession moves the declination of date by 0.15 deg at most by 2027 (20″/yr × 27 yr, Meeus 1998, ch. 21).
    expect(Math.abs(Number(m![1]) - belowDeg)).toBeLessThan(0.2);
  });

  it('observable targets do not get it', () => {
    for (const id of ['Vago-2', 'Tarsa-4']) expect(warningsOf(id).some((w) => w.includes('never observable'))).toBe(false);
    expect(plan.visits.some((v) => v.starId === 'Tarsa-4')).toBe(true);
  });
});

describe("phase lost by the window's end", () => {
  // Phase error at the window's end (the next local midnight after its last night):
  // sigma_phi = sqrt(sigma_Tc^2 + x^2 sigma_P^2) / P with x = (t - Tc)/P (linear error propagation,
  // common practice), t as a Julian date (JD 2440587.5 = 1970-01-01 0 h UTC, common practice; the
  // BJD correction, minutes at most, does not matter at this scale).
  const phaseErrAtEnd = (id: string) => {
    const eph = campaign.targets.find((t) => t.id === id)!.ephemeris!;
    const endJd = 2440587.5 + DateTime.fromISO(campaign.window.end, { zone: campaign.site.timeZone }).plus({ days: 1 }).toMillis() / 86_400_000;
    const x = (endJd - eph.tcBjdTdb) / eph.periodDays;
    return Math.hypot(eph.tcErrDays, x * eph.periodErrDays) / eph.periodDays;
  };

  it('a period known to 0.03 d: phase error above 0.25 cycle by the end, and the warning with the visits a recovery takes', () => {
    expect(phaseErrAtEnd('Vago-2')).toBeGreaterThan(0.25);
    const summary = plan.targets.find((t) => t.targetId === 'Vago-2')!;
    expect(summary.phaseErrAtEnd).toBeCloseTo(phaseErrAtEnd('Vago-2'), 3);
    // Fisher information on the phase of K sin(2 pi phi + delta) from N visits spread in phase:
    // N K^2 / (2 sigma^2) (common practice), so sigma_phi = 0.05 cycle takes N = 2 sigma^2 / (2 pi K 0.05)^2.
    const target = campaign.targets.find((t) => t.id === 'Vago-2')!;
    const exposureSec = plan.visits.find((v) => v.starId === 'Vago-2')?.exposureSec ?? 600;
    const sigma = visitPrecision(campaign.instrument, target, exposureSec, 1.2).effectiveSigmaMps;
    const n = Math.max(3, Math.ceil((2 * sigma ** 2) / (2 * Math.PI * summary.kMps! * 0.05) ** 2));
    expect(warningsOf('Vago-2').some((w) => w.includes('phase must be recovered first') && w.includes(`about ${n} visits spread in phase`))).toBe(true);
  });

  it('a well-known ephemeris: phase error far below 0.1 cycle, no warning', () => {
    expect(phaseErrAtEnd('Tarsa-4')).toBeLessThan(0.01);
    expect(warningsOf('Tarsa-4').some((w) => w.includes('phase must be recovered'))).toBe(false);
  });
});

describe('goal not reached on the demo cut to 7 nights', () => {
  it('names the visits at quadratures that would reach it: N = ceil((n sigma / K)^2) (docs/references.md [Visits-needed])', () => {
    const demo = { ...readCampaign(DEMO_CAMPAIGN), time: { mode: 'choose-nights', nights: 7 } as const };
    const demoPlan = buildPlan(demo, { weatherTrials: 10 });
    const short = demoPlan.targets.filter((t) => t.kind === 'ephemeris' && t.kOverSigmaK! < t.goalSignificance!);
    expect(short.length).toBeGreaterThan(0);
    for (const t of short) {
      const target = demo.targets.find((x) => x.id === t.targetId)!;
      const exposureSec = demoPlan.visits.find((v) => v.starId === t.starId)!.exposureSec;
      const sigma = visitPrecision(demo.instrument, target, exposureSec, 1.2).effectiveSigmaMps;
      const n = Math.ceil(((t.goalSignificance! * sigma) / t.kMps!) ** 2);
      expect(t.warnings.join(' ')).toContain(`about ${n} visits at quadratures`);
    }
  });
});

/** A target list and a campaign of the given time model at La Silla, in a temporary folder. */
function smallCampaign(rows: string, time: string, extraColumn?: string): Campaign {
  const dir = mkdtempSync(path.join(tmpdir(), 'crest-causes-'));
  const header = `id,ra,dec,vmag,teffK,periodDays,tcBjdTdb,planetMsiniEarth,priority${extraColumn ? `,${extraColumn}` : ''}`;
  writeFileSync(path.join(dir, 'targets.csv'), `${header}\n${rows}`);
  writeFileSync(
    path.join(dir, 'campaign.yaml'),
    `name: Causes\nsite: la-silla\ninstrument: stable-4m\ntargets: targets.csv\nwindow: { start: 2027-03-15, end: 2027-03-28 }\ntime: ${time}\n` +
      'constraints: { maxAirmass: 2.0, moonSeparationDeg: 30 }\n',
  );
  return readCampaign(path.join(dir, 'campaign.yaml'));
}

describe('why a star got no visit', () => {
  it('the Moon on the one given night: a star placed where the Moon stands that night (astronomy-engine geocentric place)', () => {
    // Full Moon on 2027-03-22 (from memory); its place at local midnight at La Silla (03:00 UTC).
    const moon = Equator(Body.Moon, MakeTime(new Date('2027-03-22T03:00:00Z')), new Observer(-29.2567, -70.73, 2400), false, true);
    const ra = `${Math.floor(moon.ra)}:${String(Math.round((moon.ra % 1) * 60)).padStart(2, '0')}:00`;
    const dec = `${moon.dec < 0 ? '-' : '+'}${String(Math.abs(Math.trunc(moon.dec))).padStart(2, '0')}:00:00`;
    const plan = buildPlan(smallCampaign(`Luna-9,${ra},${dec},9.0,5500,4.5,2461400.1,30,1\n`, '{ mode: given-nights, dates: [2027-03-21] }'), {
      weatherTrials: 10,
    });
    const [warning] = plan.targets[0]!.warnings;
    expect(plan.visits).toEqual([]);
    expect(warning).toMatch(
      new RegExp(
        '^goal K/sigma_K = 5 not reached: 0\\.0 with no visit: no window on the planned night ' +
          '\\(too close to the Moon on the planned night\\); it has windows on \\d+ other nights of the window',
      ),
    );
  });

  it('the budget: a low-priority star beside a high-priority one, time for one long visit in all', () => {
    // Each visit exposes 3000 s (the target's own exposureSec), so 1.2 hours hold one block.
    const rows = 'Alto-1,10:00:00,-30:00:00,9.0,5500,4.5,2461400.1,30,10,3000\nBajo-2,10:20:00,-32:00:00,9.0,5500,5.5,2461400.3,30,0.1,3000\n';
    const plan = buildPlan(smallCampaign(rows, '{ mode: hours, hours: 1.2 }', 'exposureSec'), { weatherTrials: 10 });
    expect(plan.visits.length).toBe(1);
    expect(plan.visits.every((v) => v.starId === 'Alto-1')).toBe(true);
    const bajo = plan.targets.find((t) => t.targetId === 'Bajo-2')!;
    expect(bajo.warnings.join(' ')).toMatch(/no visit: the usable time went to visits of more value, though it has windows on 14 of the 14 usable nights/);
  });
});

describe('a window without darkness', () => {
  it('78 deg N in June: no dark span on any night, no visit, and both plan-wide warnings', () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'crest-arctic-'));
    writeFileSync(
      path.join(dir, 'targets.csv'),
      'id,ra,dec,vmag,teffK,periodDays,tcBjdTdb,planetMsiniEarth\nNorda-1,18:00:00,+60:00:00,9,5200,4.2,2461500.3,20\n',
    );
    writeFileSync(
      path.join(dir, 'campaign.yaml'),
      `name: Arctic\nsite: ${path.resolve('test/fixtures/sites/high-arctic.json')}\ninstrument: stable-2m\ntargets: targets.csv\n` +
        'window: { start: 2027-06-15, end: 2027-06-18 }\ntime: { mode: choose-nights, nights: 2 }\n',
    );
    const arctic = buildPlan(readCampaign(path.join(dir, 'campaign.yaml')), { weatherTrials: 10 });
    expect(arctic.visits).toEqual([]);
    expect(arctic.warnings.some((w) => w.startsWith('no night of the window has a dark span'))).toBe(true);
    expect(arctic.warnings.some((w) => w.startsWith('no visit could be planned'))).toBe(true);
  });
});

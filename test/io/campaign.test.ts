import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { DEMO_CAMPAIGN } from '../../src/io/paths.js';

const TARGETS = 'id,ra,dec,vmag,teffK\nAlba,10:00:00,-30:00:00,9.5,5200\n';

/** A campaign folder with a target list; returns the campaign file's path. */
function campaignFile(text: string, name = 'campaign.yaml', extra: Record<string, string> = {}): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'crest-campaign-'));
  writeFileSync(path.join(dir, 'targets.csv'), TARGETS);
  for (const [file, content] of Object.entries(extra)) writeFileSync(path.join(dir, file), content);
  writeFileSync(path.join(dir, name), text);
  return path.join(dir, name);
}

const BASE = 'name: Test\nsite: la-silla\ninstrument: stable-2m\ntargets: targets.csv\nwindow: { start: 2027-03-01, end: 2027-03-31 }\n';

describe('campaign files', () => {
  it('reads the bundled demo with its site, instrument and targets', () => {
    const c = readCampaign(DEMO_CAMPAIGN);
    expect(c.site.id).toBe('la-silla');
    expect(c.instrument.id).toBe('stable-4m');
    expect(c.targets.length).toBeGreaterThanOrEqual(8);
    expect(c.time.mode).toBe('choose-nights');
  });

  it('takes a semester instead of dates: default A is 1 February to 31 July, B runs into the next year', () => {
    const win = (label: string) =>
      readCampaign(campaignFile(`${BASE.replace(/window: .*\n/, `window: { semester: ${label} }\n`)}time: { mode: hours, hours: 5 }\n`)).window;
    expect(win('2027A')).toEqual({ start: '2027-02-01', end: '2027-07-31' });
    expect(win('2027B')).toEqual({ start: '2027-08-01', end: '2028-01-31' });
    expect(() => win('2027C')).toThrow(/window\.semester = "2027C": a semester such as 2027A/);
  });

  it("uses a site file's own semester boundaries", () => {
    const site = JSON.stringify({
      id: 'cerro-example',
      name: 'Cerro Example',
      latitudeDeg: -30,
      longitudeDeg: -70,
      elevationM: 2000,
      timeZone: 'America/Santiago',
      clearFraction: 0.7,
      sourceNote: 'invented',
      semesters: { A: { start: '04-01', end: '09-30' }, B: { start: '10-01', end: '03-31' } },
    });
    const withSite = BASE.replace('site: la-silla', 'site: ./s.json');
    const text = `${withSite.replace(/window: .*\n/, 'window: { semester: 2028B }\n')}time: { mode: hours, hours: 5 }\n`;
    expect(readCampaign(campaignFile(text, 'campaign.yaml', { 's.json': site })).window).toEqual({ start: '2028-10-01', end: '2029-03-31' });
  });

  it('fills documented defaults for constraints, goals and seed', () => {
    const c = readCampaign(campaignFile(`${BASE}time: { mode: hours, hours: 12 }\n`));
    expect(c.constraints).toEqual({
      twilight: 'nautical',
      maxAirmass: 2,
      moonSeparationDeg: 30,
      minSpacingHours: 20,
      sameNightSpacingHours: 2,
      minWindowMinutes: 20,
    });
    expect(c.goals).toEqual({ significance: 5, probability: 0.9, searchCompleteness: 0.5 });
    expect(c.seed).toBe(1);
  });

  it('reads JSON as well, and site or instrument files by path relative to the campaign', () => {
    const site = JSON.stringify({
      id: 'cerro-example',
      name: 'Cerro Example',
      latitudeDeg: -30,
      longitudeDeg: -70,
      elevationM: 2000,
      timeZone: 'America/Santiago',
      clearFraction: 0.7,
      sourceNote: 'invented',
    });
    const json = JSON.stringify({
      name: 'J',
      site: './my-site.json',
      instrument: 'compact-1m',
      targets: 'targets.csv',
      window: { start: '2027-01-01', end: '2027-01-05' },
      time: { mode: 'given-nights', dates: ['2027-01-02'] },
    });
    const c = readCampaign(campaignFile(json, 'campaign.json', { 'my-site.json': site }));
    expect(c.site.id).toBe('cerro-example');
    expect(c.time).toEqual({ mode: 'given-nights', dates: ['2027-01-02'] });
  });

  it.each([
    [
      'a date outside the window',
      `${BASE}time: { mode: given-nights, dates: [2027-03-05, 2027-04-02] }\n`,
      /campaign\.yaml: time\.dates\[1\] = "2027-04-02": a date inside the window/,
    ],
    ['an unknown time mode', `${BASE}time: { mode: every-night }\n`, /campaign\.yaml: time(\.mode)? = .*choose-nights, given-nights, hours/],
    [
      'a misspelt constraint',
      `${BASE}time: { mode: hours, hours: 5 }\nconstraints: { maxAirmas: 2 }\n`,
      /campaign\.yaml: constraints\.maxAirmas = 2: unknown key/,
    ],
    [
      'an airmass limit below 1',
      `${BASE}time: { mode: hours, hours: 5 }\nconstraints: { maxAirmass: 0.5 }\n`,
      /campaign\.yaml: constraints\.maxAirmass = 0\.5: an airmass from 1 to 5/,
    ],
    [
      'a same-night spacing above 12 h',
      `${BASE}time: { mode: hours, hours: 5 }\nconstraints: { sameNightSpacingHours: 13 }\n`,
      /campaign\.yaml: constraints\.sameNightSpacingHours = 13: hours from 0 to 12$/,
    ],
    [
      'a bad date',
      `${BASE.replace('2027-03-31', '2027-02-30')}time: { mode: hours, hours: 5 }\n`,
      /campaign\.yaml: window\.end = "2027-02-30": a date as YYYY-MM-DD/,
    ],
    ['no time model', BASE, /campaign\.yaml: time = \(missing\)/],
    [
      'a goal probability above 0.99',
      `${BASE}time: { mode: hours, hours: 5 }\ngoals: { probability: 1 }\n`,
      /campaign\.yaml: goals\.probability = 1: a probability from 0\.5 to 0\.99$/,
    ],
    [
      'half a night without half nights',
      `${BASE}time: { mode: choose-nights, nights: 6.5 }\n`,
      /campaign\.yaml: time\.nights = 6\.5: a whole number of nights \(or set halfNights: true\)$/,
    ],
    [
      'a quarter night with half nights',
      `${BASE}time: { mode: choose-nights, nights: 6.25, halfNights: true }\n`,
      /campaign\.yaml: time\.nights = 6\.25: a multiple of 0\.5 nights$/,
    ],
    [
      'hours mode without hours',
      `${BASE}time: { mode: hours }\n`,
      /campaign\.yaml: time\.hours = \(missing\): required: a positive number of hours, at most 5000$/,
    ],
    [
      'nights given as text',
      `${BASE}time: { mode: choose-nights, nights: ten }\n`,
      /campaign\.yaml: time\.nights = "ten": a whole number of nights, 1 to 366 \(halves with halfNights\)$/,
    ],
    [
      'a missing target list',
      `${BASE.replace('targets.csv', 'other.csv')}time: { mode: hours, hours: 5 }\n`,
      /campaign\.yaml: targets = "other\.csv": a target list file \(.*other\.csv does not exist\)$/,
    ],
    [
      'a search completeness goal above 1',
      `${BASE}time: { mode: hours, hours: 5 }\ngoals: { searchCompleteness: 1.5 }\n`,
      /campaign\.yaml: goals\.searchCompleteness = 1\.5: a completeness above 0 and at most 1$/,
    ],
  ])('names the key of a bad value: %s', (_name, text, message) => {
    expect(() => readCampaign(campaignFile(text))).toThrow(message);
  });
});

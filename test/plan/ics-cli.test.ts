// `crest plan` writing plan.ics into a folder that already holds a plan (in-process, on the build:
// run `npm run build` first): SOURCE_DATE_EPOCH (reproducible-builds.org convention) as DTSTAMP,
// the same bytes from the same inputs, and the previous plan.json read for cancelled events.
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { planFromJson } from '../../src/io/plan-json.js';
import { runCliInProcess, tempFiles, type CliResult } from '../cli/run-cli.js';
import { icsMismatches, parseIcs } from './check-ics.js';
import { fixture } from './fixtures.js';

const read = (dir: string, name: string) => readFileSync(path.join(dir, name), 'utf8');
const readPlanJson = (dir: string) => planFromJson(JSON.parse(read(dir, 'plan.json')), 'plan.json');

/** `crest plan <small fixture> --out dir` with SOURCE_DATE_EPOCH set to `epoch` (unset when undefined). */
async function plan(dir: string, epoch: string | undefined): Promise<CliResult> {
  const saved = process.env.SOURCE_DATE_EPOCH;
  if (epoch === undefined) delete process.env.SOURCE_DATE_EPOCH;
  else process.env.SOURCE_DATE_EPOCH = epoch;
  try {
    return await runCliInProcess(['plan', fixture('small'), '--out', dir, '--json']);
  } finally {
    if (saved === undefined) delete process.env.SOURCE_DATE_EPOCH;
    else process.env.SOURCE_DATE_EPOCH = saved;
  }
}

describe('crest plan and plan.ics', () => {
  it('SOURCE_DATE_EPOCH is every DTSTAMP; two runs give the same bytes; a re-plan into the same folder cancels nothing', async () => {
    const [a, b] = [path.join(tempFiles({}), 'out'), path.join(tempFiles({}), 'out')];
    expect((await plan(a, '1700000000')).status).toBe(0);
    expect((await plan(b, '1700000000')).status).toBe(0);
    expect(read(a, 'plan.ics')).toBe(read(b, 'plan.ics'));
    // 1700000000 s since 1970 is 2023-11-14T22:13:20Z (date -u -d @1700000000, common practice).
    const events = parseIcs(read(a, 'plan.ics')).events;
    expect(events.length).toBeGreaterThan(0);
    expect(events.every((e) => e.stampMs === Date.parse('2023-11-14T22:13:20Z'))).toBe(true);
    const first = read(a, 'plan.ics');
    const again = await plan(a, '1700000000');
    expect(again.stderr).toBe('');
    expect(read(a, 'plan.ics')).toBe(first);
  });

  it('a visit of the previous plan.json that the new plan lacks is one STATUS:CANCELLED event', async () => {
    const dir = path.join(tempFiles({}), 'out');
    expect((await plan(dir, undefined)).status).toBe(0);
    const previous = readPlanJson(dir);
    // The previous plan had its first visit on 2 April instead, a night the campaign does not use.
    const data = JSON.parse(read(dir, 'plan.json')) as { visits: { localDate: string }[] };
    data.visits[0]!.localDate = '2027-04-02';
    writeFileSync(path.join(dir, 'plan.json'), JSON.stringify(data));
    const moved = planFromJson(data, 'plan.json');
    const r = await plan(dir, undefined);
    expect([r.status, r.stderr]).toEqual([0, '']);
    const text = read(dir, 'plan.ics');
    expect(
      parseIcs(text)
        .events.filter((e) => e.status === 'CANCELLED')
        .map((e) => e.uid),
    ).toEqual([`${previous.visits[0]!.starId}-2027-04-02-1@crest`]);
    expect(icsMismatches(readPlanJson(dir), text, moved)).toEqual([]);
  });

  it('a previous plan.json that cannot be read: exit 0, one line on stderr, nothing cancelled', async () => {
    const dir = tempFiles({ 'plan.json': '{"schemaVersion": 1' });
    const r = await plan(dir, undefined);
    expect(r.status).toBe(0);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toContain('plan.json');
    expect(parseIcs(read(dir, 'plan.ics')).events.filter((e) => e.status !== null)).toEqual([]);
  });

  it('a previous plan.json of another campaign: nothing cancelled', async () => {
    const dir = path.join(tempFiles({}), 'out');
    expect((await plan(dir, undefined)).status).toBe(0);
    const data = JSON.parse(read(dir, 'plan.json')) as { campaign: { name: string }; visits: { localDate: string }[] };
    data.campaign.name = 'Moravec survey';
    data.visits[0]!.localDate = '2027-04-02';
    writeFileSync(path.join(dir, 'plan.json'), JSON.stringify(data));
    const r = await plan(dir, undefined);
    expect([r.status, r.stderr]).toEqual([0, '']);
    expect(parseIcs(read(dir, 'plan.ics')).events.filter((e) => e.status !== null)).toEqual([]);
  });

  it.each(['yesterday', '-5', '1.5', '99999999999999'])('SOURCE_DATE_EPOCH=%s: exit 2, one line naming it', async (epoch) => {
    const dir = path.join(tempFiles({}), 'out');
    const r = await plan(dir, epoch);
    expect(r.status).toBe(2);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toContain('SOURCE_DATE_EPOCH');
  });
});

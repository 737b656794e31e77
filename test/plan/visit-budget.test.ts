// The memory guard (src/plan/visit-budget.ts): the count of candidate visits from the windows
// against the visits candidateSlots really builds, and the refusal of a campaign above a small
// heap limit passed in, before its visits are built (no large run: ten nights, three stars); and
// `crest plan` in a process with a 64 MB heap on 100 stars over 180 nights: exit 2, one line, no files.
import { spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { inventedCampaign } from '../../reference/invented-campaign.js';
import { InputError } from '../../src/errors.js';
import { readCampaign } from '../../src/io/campaign.js';
import type { Campaign } from '../../src/plan/campaign.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { planInputs } from '../../src/plan/plan-inputs.js';
import { candidateVisitCount, FIXED_HEAP_BYTES, HEAP_BYTES_PER_VISIT, HEAP_SHARE } from '../../src/plan/visit-budget.js';
import { CLI, tempFiles } from '../cli/run-cli.js';
import { DEMO_CAMPAIGN } from '../../src/io/paths.js';

/** Three invented stars (no transit durations, so no block is left out) over ten nights. */
function smallCampaign(): Campaign {
  const { campaignYaml, targetsCsv } = inventedCampaign({ candidates: 3, seed: 7 });
  const dir = tempFiles({ 'campaign.yaml': campaignYaml, 'targets.csv': targetsCsv });
  const campaign = readCampaign(path.join(dir, 'campaign.yaml'));
  return { ...campaign, window: { start: '2027-04-01', end: '2027-04-10' }, time: { mode: 'choose-nights', nights: 3 } };
}

const openDates = (inputs: ReturnType<typeof planInputs>) => new Set(inputs.left.nights.map((n) => n.localDate));

describe('candidate visits counted from the windows', () => {
  const campaign = smallCampaign();
  const inputs = planInputs(campaign, {});

  it('equal the visits built when no block overlaps a transit', () => {
    expect(inputs.candidates.length).toBeGreaterThan(100);
    expect(candidateVisitCount(inputs.windows, inputs.stars, openDates(inputs))).toBe(inputs.candidates.length);
  });

  it('are an upper bound when transits take blocks out (the demo)', () => {
    const demo = readCampaign(DEMO_CAMPAIGN);
    const short = planInputs({ ...demo, window: { start: '2027-03-01', end: '2027-03-05' }, time: { mode: 'choose-nights', nights: 2 } }, {});
    expect(candidateVisitCount(short.windows, short.stars, openDates(short))).toBeGreaterThanOrEqual(short.candidates.length);
  });

  it('count only the nights still open', () => {
    expect(candidateVisitCount(inputs.windows, inputs.stars, new Set())).toBe(0);
  });
});

describe('a campaign too large for the heap', () => {
  const campaign = smallCampaign();
  const visits = planInputs(campaign, {}).candidates.length;
  /** The heap limit at which these visits just fit their share. */
  const fitLimitBytes = (FIXED_HEAP_BYTES + visits * HEAP_BYTES_PER_VISIT) / HEAP_SHARE;

  it('is refused before its visits are built, in one line naming its size and what to reduce', () => {
    const stages: string[] = [];
    let error: unknown;
    try {
      buildPlan(campaign, { heapLimitBytes: fitLimitBytes * 0.99, onStage: (s) => stages.push(s) });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(InputError);
    const message = (error as Error).message;
    expect(message.split('\n')).toHaveLength(1);
    expect(message).toContain(campaign.file);
    expect(message).toContain(`${visits} candidate visits`);
    for (const what of ['window', 'fewer candidates', 'maxAirmass', '10 min']) expect(message).toContain(what);
    // It stops at the candidate visits: no optimisation was started.
    expect(stages.at(-1)).toBe('candidate visits');
  });

  it('is planned when the limit holds it', () => {
    expect(planInputs(campaign, { heapLimitBytes: fitLimitBytes * 1.01 }).candidates).toHaveLength(visits);
  });
});

describe('crest plan with a small heap', () => {
  it('exits 2 with one line and writes nothing, rather than crash', () => {
    const { campaignYaml, targetsCsv } = inventedCampaign({ candidates: 100, seed: 1 });
    const dir = tempFiles({ 'campaign.yaml': campaignYaml, 'targets.csv': targetsCsv });
    const run = spawnSync(process.execPath, ['--max-old-space-size=64', CLI, 'plan', 'campaign.yaml', '--out', 'out'], { cwd: dir, encoding: 'utf8' });
    expect(run.status).toBe(2);
    const lines = run.stderr.trim().split('\n');
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^crest: campaign\.yaml: campaign size = "\d+ candidate visits": 100 stars, a block every 10 min/);
    expect(existsSync(path.join(dir, 'out', 'plan.json'))).toBe(false);
  });
});

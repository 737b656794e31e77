// `crest plan --sweep-nights A:B`: each night count planned in full. Its rows equal plans built
// separately at each count (no state carried from one count to the next), every row keeps the
// properties a probability of all goals must have, and the command writes the sweep into the
// terminal text, plan.md, plan.json (read back whole) and the report.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readPlan } from '../../src/io/plan-json.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { nightsSweep, sweepRow, withNightCount } from '../../src/plan/nights-sweep.js';
import { runCliInProcess, tempFiles } from '../cli/run-cli.js';
import { randomCampaign } from './random-campaign.js';

const TRIALS = 300;

describe('nights sweep', () => {
  it('gives for each count what a plan built for that count alone gives', () => {
    // Random campaign 14 chooses 1 of its nights; from 2 nights on its goals are neither sure nor hopeless.
    const campaign = randomCampaign(14);
    const counts = [2, 3];
    const sweep = nightsSweep(campaign, counts, { weatherTrials: TRIALS });
    const alone = [3, 2].map((n) => sweepRow(buildPlan(withNightCount(campaign, n), { weatherTrials: TRIALS }), n)).sort((a, b) => a.nights - b.nights);
    expect(sweep).toEqual(alone);
    for (const row of sweep) {
      expect(row.goals.length).toBeGreaterThan(0);
      // Every goal in the same trial is no likelier than the least likely goal.
      expect(row.allGoalsProbability).toBeLessThanOrEqual(Math.min(...row.goals.map((g) => g.goalProbability)));
      expect(row.idleHours).toBeLessThanOrEqual(row.darkHours);
      expect(row.darkHours - row.idleHours).toBeCloseTo(Math.min(row.totalHours, row.darkHours), 6);
    }
    // Not a trivial case: the joint probability changes across the range.
    expect(new Set(sweep.map((r) => r.allGoalsProbability)).size).toBeGreaterThan(1);
  });

  it('crest plan --sweep-nights writes the sweep to every output and refuses what cannot be swept', async () => {
    const out = tempFiles({});
    const campaign = path.resolve('examples/several-a-night/campaign.yaml');
    const r = await runCliInProcess(['plan', campaign, '--out', out, '--sweep-nights', '5:6']);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/How many nights: the campaign planned in full for each count.*the plan above asks for 6/);
    expect(r.stdout).toMatch(/^nights\s+5\s+6$/m);
    expect(r.stdout).toMatch(/^P\(goal\) TARN-16\s+\d+%\s+\d+%$/m);
    const plan = readPlan(path.join(out, 'plan.json'));
    expect(plan.nightsSweep!.map((row) => row.nights)).toEqual([5, 6]);
    // The campaign's own count is the plan itself.
    const own = plan.nightsSweep![1]!;
    expect(own.visits).toBe(plan.totals.visits);
    expect(own.allGoalsProbability).toBe(plan.totals.allGoalsProbability);
    expect(own.goals).toEqual(
      plan.targets.filter((s) => s.goalProbability !== undefined).map((s) => ({ targetId: s.targetId, goalProbability: s.goalProbability })),
    );
    expect(readFileSync(path.join(out, 'plan.md'), 'utf8')).toMatch(/## How many nights/);
    const html = readFileSync(path.join(out, 'report.html'), 'utf8');
    expect(html).toMatch(/<h2 id="sweep-section">How many nights<\/h2>/);
    expect(html).toMatch(/class="chart chart-nights-sweep"/);

    const bad = await runCliInProcess(['plan', campaign, '--out', out, '--sweep-nights', '6:3']);
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim()).toMatch(/^crest: command line: --sweep-nights = "6:3": A:B, night counts with 1 <= A < B <= 366/);
    const hours = tempFiles({
      'c.yaml': readFileSync(campaign, 'utf8').replace('{ mode: choose-nights, nights: 6 }', '{ mode: hours, hours: 10 }'),
      'targets.csv': readFileSync(path.join(path.dirname(campaign), 'targets.csv'), 'utf8'),
    });
    const queue = await runCliInProcess(['plan', path.join(hours, 'c.yaml'), '--out', path.join(hours, 'out'), '--sweep-nights', '2:4']);
    expect(queue.status).toBe(2);
    expect(queue.stderr.trim()).toMatch(/--sweep-nights = "2:4": only for campaigns with time.mode choose-nights \(.*c\.yaml has hours\)$/);
  });
});

// `crest next` bench: the answer for the demo campaign and for the demo 18 days in (observed
// visits and RVs), at a few instants of one night (median time), beside the brute-force ranking
// of the same candidates with every gain recomputed from scratch (reference/schedule.ts).
import path from 'node:path';
import { readCampaign } from '../src/io/campaign.js';
import { DEMO_CAMPAIGN, PACKAGE_ROOT } from '../src/io/paths.js';
import type { Campaign } from '../src/plan/campaign.js';
import { nextVisits } from '../src/plan/next-visits.js';
import { planInputs } from '../src/plan/plan-inputs.js';
import { referenceUtility } from '../reference/schedule.js';
import { timeSec, type BenchModule } from './types.js';

const INSTANTS = ['2027-03-21T00:30:00Z', '2027-03-21T03:40:00Z', '2027-03-21T06:10:00Z', '2027-03-21T08:50:00Z', '2027-03-22T02:00:00Z'];
const SETTINGS = { overshootWeight: 0.1 };

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[xs.length >> 1]!;

/** Gains per hour of every candidate from scratch, best first (the brute-force reference). */
function bruteForce(campaign: Campaign, at: Date, localDate: string): string[] {
  const inputs = planInputs(
    { ...campaign, window: { start: localDate, end: localDate }, time: { mode: 'given-nights', dates: [localDate] }, lostDates: [] },
    { now: at },
  );
  const base = referenceUtility(inputs.problem, [], SETTINGS);
  const first = new Map<string, (typeof inputs.problem.slots)[number]>();
  for (const s of [...inputs.problem.slots].sort((a, b) => a.startMs - b.startMs))
    if (s.startMs < at.getTime() + 600_000 && !first.has(s.targetId)) first.set(s.targetId, s);
  return [...first.values()]
    .map((s) => ({ id: s.targetId, value: (referenceUtility(inputs.problem, [s], SETTINGS) - base) / (s.durationSec / 3600) }))
    .sort((a, b) => b.value - a.value || a.id.localeCompare(b.id))
    .map((x) => x.id);
}

function runCase(name: string, campaign: Campaign): Record<string, unknown> {
  const fast: number[] = [];
  const slow: number[] = [];
  let agree = 0;
  for (const iso of INSTANTS) {
    const at = new Date(iso);
    const answer = timeSec(() => nextVisits(campaign, at));
    const reference = timeSec(() => bruteForce(campaign, at, answer.value.localDate));
    fast.push(answer.sec);
    slow.push(reference.sec);
    if ((answer.value.now[0]?.starId ?? '') === (reference.value[0] ?? '')) agree++;
  }
  return {
    case: name,
    instants: INSTANTS.length,
    medianSec: Number(median(fast).toFixed(3)),
    bruteForceMedianSec: Number(median(slow).toFixed(3)),
    firstChoiceAgrees: `${agree}/${INSTANTS.length}`,
  };
}

export const nextBench: BenchModule = {
  name: 'next',
  run: () => {
    const demo = runCase('demo', readCampaign(DEMO_CAMPAIGN));
    const underWay = runCase('demo 18 days in (47 RVs)', readCampaign(path.join(PACKAGE_ROOT, 'examples', 'under-way', 'campaign.yaml')));
    return { cases: [demo, underWay] };
  },
};

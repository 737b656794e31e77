// Progress on stderr: drawn only on a terminal and never with --quiet, cleared at the end; the
// plan's stages reported once each in their order, without changing the plan.
import { describe, expect, it } from 'vitest';
import { stderrProgress } from '../../src/cli/progress.js';
import { readCampaign } from '../../src/io/campaign.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { PLAN_STAGES, type PlanStage } from '../../src/plan/plan-stages.js';
import { fixture } from '../plan/fixtures.js';

/** Carriage return, then erase to the end of the line (ECMA-48 EL). */
const CLEAR_LINE = '\r\x1b[K';

/** A stand-in for process.stderr that records what is written. */
function fakeStream(isTTY: boolean): { stream: NodeJS.WriteStream; written: string[] } {
  const written: string[] = [];
  const stream = { isTTY, write: (text: string) => written.push(text) > 0 } as unknown as NodeJS.WriteStream;
  return { stream, written };
}

describe('stderrProgress', () => {
  it('on a terminal: one line per new percentage, rewritten in place, cleared at the end', () => {
    const { stream, written } = fakeStream(true);
    const progress = stderrProgress({ stream, unit: 'stages', showAfterMs: 0 });
    progress.update('crest plan: nights', 0, 8);
    progress.update('crest plan: nights', 0, 8);
    progress.update('crest plan: windows', 4, 8);
    progress.end();
    expect(written).toHaveLength(3);
    expect(written[0]!.startsWith(CLEAR_LINE)).toBe(true);
    expect(written[0]!.slice(CLEAR_LINE.length)).toMatch(/^crest plan: nights \[\.{30}\] {3}0% \(0\/8 stages\)$/);
    expect(written[1]!.startsWith(CLEAR_LINE)).toBe(true);
    expect(written[1]!.slice(CLEAR_LINE.length)).toMatch(/^crest plan: windows \[#{15}\.{15}\] {2}50% \(4\/8 stages\)$/);
    expect(written[2]).toBe(CLEAR_LINE);
  });

  it('nothing when stderr is not a terminal, with --quiet, or before the delay', () => {
    for (const [isTTY, options] of [
      [false, {}],
      [true, { quiet: true }],
      [true, { showAfterMs: 60_000 }],
    ] as const) {
      const { stream, written } = fakeStream(isTTY);
      const progress = stderrProgress({ stream, showAfterMs: 0, ...options });
      progress.update('x', 1, 2);
      progress.end();
      expect(written).toEqual([]);
    }
  });
});

describe('the stages of a plan', () => {
  it('are told once each, in their order, and leave the plan as it is', () => {
    const campaign = readCampaign(fixture('small'));
    const told: PlanStage[] = [];
    const withStages = buildPlan(campaign, { weatherTrials: 10, onStage: (s) => told.push(s) });
    expect(told).toEqual([...PLAN_STAGES]);
    expect(JSON.stringify(withStages)).toBe(JSON.stringify(buildPlan(campaign, { weatherTrials: 10 })));
  });
});

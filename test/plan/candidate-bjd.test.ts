// The planner's candidate visits carry BJD_TDB from a night's interpolated Earth track
// (src/astro/earth-track.ts); here every demo candidate (a seeded sample) against the direct
// computation for its star at mid-exposure (src/astro/bjd.ts, BaryState at that instant).
// Within 1 ms, phases move by under 1e-8 cycle, so the plan cannot tell the two apart.
import { describe, expect, it } from 'vitest';
import { starBjdTdb } from '../../src/astro/bjd.js';
import { readCampaign } from '../../src/io/campaign.js';
import { DEMO_CAMPAIGN } from '../../src/io/paths.js';
import { planInputs } from '../../src/plan/plan-inputs.js';
import { createRng } from '../../src/rv/random.js';

describe('candidate visits of the demo: interpolated BJD_TDB against the direct computation', () => {
  it('a seeded sample of 3,000 candidates over the 92 nights, every one within 1 ms', () => {
    const campaign = readCampaign(DEMO_CAMPAIGN);
    const inputs = planInputs(campaign, {});
    const rng = createRng(7);
    let worstMs = 0;
    for (let k = 0; k < 3000; k++) {
      const c = inputs.candidates[Math.floor(rng.uniform() * inputs.candidates.length)]!;
      const star = campaign.targets.find((t) => t.starId === c.slot.targetId)!;
      const { exposureSec } = inputs.detail(c);
      const midMs = c.slot.startMs + campaign.instrument.acquisitionSec * 1000 + (exposureSec * 1000) / 2;
      worstMs = Math.max(worstMs, Math.abs(c.slot.midBjdTdb - starBjdTdb(new Date(midMs), star)) * 86_400_000);
    }
    console.info(`demo candidates: worst |interpolated - direct| BJD_TDB ${worstMs.toFixed(3)} ms`);
    expect(inputs.candidates.length).toBeGreaterThan(10_000);
    expect(worstMs).toBeLessThan(1);
  });
});

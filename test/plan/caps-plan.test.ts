// Caps from the target list (maxVisits, maxHours) and the campaign (constraints.maxVisitsPerStar,
// maxHoursPerStar) reach the plan: the several-a-night example gives TARN-9 eighteen visits
// (README); capped, it gets no more than its cap, and bad caps are one input line each.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCampaign } from '../../src/io/campaign.js';
import { buildPlan } from '../../src/plan/build-plan.js';
import { runCliInProcess, tempFiles } from '../cli/run-cli.js';

const EXAMPLE = path.resolve('examples/several-a-night');
const campaignText = readFileSync(path.join(EXAMPLE, 'campaign.yaml'), 'utf8');
const targetsText = readFileSync(path.join(EXAMPLE, 'targets.csv'), 'utf8');

/** The example with TARN-9's row given a cap column and the campaign's constraints given `extra`. */
function example(column: string, value: string, extra = ''): string {
  const lines = targetsText.split('\n');
  const withColumn = lines.map((line) => {
    if (line.startsWith('id,')) return `${line},${column}`;
    if (line.startsWith('TARN-9,')) return `${line},${value}`;
    return line.startsWith('TARN-') ? `${line},` : line;
  });
  const campaign = campaignText.replace('sameNightSpacingHours: 2 }', `sameNightSpacingHours: 2${extra} }`);
  const dir = tempFiles({ 'campaign.yaml': campaign, 'targets.csv': withColumn.join('\n') });
  return path.join(dir, 'campaign.yaml');
}

const planOf = (file: string) => buildPlan(readCampaign(file), { weatherTrials: 50 });
const visitsOf = (file: string, star: string) => planOf(file).visits.filter((v) => v.starId === star);

describe('caps in the plan', () => {
  it("a star's maxVisits and maxHours columns, and the campaign's default", () => {
    const capped = planOf(example('maxVisits', '5'));
    expect(capped.visits.filter((v) => v.starId === 'TARN-9').length).toBe(5);
    // The summary says the star stopped at its cap, and only that star.
    expect(capped.targets.find((t) => t.targetId === 'TARN-9')!.warnings).toContain('at its cap of 5 visits (maxVisits)');
    expect(capped.targets.filter((t) => t.warnings.some((w) => w.startsWith('at its cap'))).map((t) => t.targetId)).toEqual(['TARN-9']);
    const hours = visitsOf(example('maxHours', '1'), 'TARN-9').reduce((sum, v) => sum + v.durationSec / 3600, 0);
    expect(hours).toBeLessThanOrEqual(1 + 1e-9);
    expect(hours).toBeGreaterThan(0.5);
    // The campaign's default caps every star; TARN-9's own column wins over it.
    const file = example('maxVisits', '7', ', maxVisitsPerStar: 3');
    expect(visitsOf(file, 'TARN-9').length).toBe(7);
    expect(visitsOf(file, 'TARN-16').length).toBeLessThanOrEqual(3);
    expect(visitsOf(file, 'TARN-21').length).toBeLessThanOrEqual(3);
  });

  it('refuses a cap that is not one, with one line and status 2', async () => {
    const bad = await runCliInProcess(['plan', example('maxVisits', '2.5'), '--out', tempFiles({})]);
    expect(bad.status).toBe(2);
    expect(bad.stderr.trim()).toMatch(/targets\.csv: row 1 \(line 3\): maxVisits = "2\.5": most visits of the star this campaign plans, a whole number/);
    const zero = await runCliInProcess(['plan', example('maxHours', '2', ', maxHoursPerStar: 0'), '--out', tempFiles({})]);
    expect(zero.status).toBe(2);
    expect(zero.stderr.trim().split('\n')).toHaveLength(1);
    expect(zero.stderr).toMatch(/constraints\.maxHoursPerStar = 0: more than 0 hours/);
  });
});

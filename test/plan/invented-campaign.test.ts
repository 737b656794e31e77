// The bench's invented campaigns (reference/invented-campaign.ts): the same texts for a seed, what
// they promise (N stars, about a tenth blind searches, southern declinations, 180 nights, choose
// 20), and Crest's own readers take them.
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { inventedCampaign } from '../../reference/invented-campaign.js';
import { readCampaign } from '../../src/io/campaign.js';
import { tempFiles } from '../cli/run-cli.js';

const rows = (csv: string) =>
  csv
    .trim()
    .split('\n')
    .slice(1)
    .map((line) => line.split(','));

describe('invented campaigns', () => {
  const big = inventedCampaign({ candidates: 1000, seed: 3 });

  it('are the same texts for the same seed and differ for another', () => {
    expect(inventedCampaign({ candidates: 1000, seed: 3 })).toEqual(big);
    expect(inventedCampaign({ candidates: 1000, seed: 4 }).targetsCsv).not.toBe(big.targetsCsv);
  });

  it('hold N distinct stars, about a tenth of them blind searches, between −80° and +20°', () => {
    const table = rows(big.targetsCsv);
    expect(new Set(table.map((r) => r[0])).size).toBe(1000);
    const searches = table.filter((r) => r[5] === '').length;
    // Binomial(1000, 0.1): mean 100, σ 9.5; 70..130 is beyond 3σ (common practice).
    expect(searches).toBeGreaterThan(70);
    expect(searches).toBeLessThan(130);
    for (const r of table) {
      expect(Number(r[2])).toBeGreaterThanOrEqual(-80);
      expect(Number(r[2])).toBeLessThanOrEqual(20);
    }
  });

  it('read as a 180-night campaign choosing 20 nights at La Silla', () => {
    const { campaignYaml, targetsCsv } = inventedCampaign({ candidates: 30, seed: 1 });
    const campaign = readCampaign(path.join(tempFiles({ 'campaign.yaml': campaignYaml, 'targets.csv': targetsCsv }), 'campaign.yaml'));
    expect(campaign.targets).toHaveLength(30);
    expect(campaign.site.id).toBe('la-silla');
    expect(campaign.time).toMatchObject({ mode: 'choose-nights', nights: 20 });
    const days = (Date.parse(campaign.window.end) - Date.parse(campaign.window.start)) / 86_400_000 + 1;
    expect(days).toBe(180);
  });
});

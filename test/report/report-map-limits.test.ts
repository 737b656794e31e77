// Once `crest map` has simulated a blind search, the report's proposal paragraph quotes the
// simulated 50% and 90% limits for that star (and names them), and keeps the analytic limit,
// named as such, for the stars without a map.
import { copyFileSync, mkdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCliInProcess, tempFiles } from '../cli/run-cli.js';
import { demoRuns } from '../support/demo-plan.js';

/** The first mass of a row reaching `level`, linear in log mass from the grid point before (slow reference). */
function firstCrossing(masses: number[], row: number[], level: number): number | undefined {
  for (let j = 1; j < row.length; j++) {
    if (row[j - 1]! < level && row[j]! >= level) {
      const f = (level - row[j - 1]!) / (row[j]! - row[j - 1]!);
      return Math.exp(Math.log(masses[j - 1]!) + f * (Math.log(masses[j]!) - Math.log(masses[j - 1]!)));
    }
  }
  return undefined;
}

describe('report paragraph and simulated maps', () => {
  it('quotes the simulated limits of a mapped star and the analytic ones of the others', async () => {
    const dir = path.join(tempFiles({}), 'demo');
    mkdirSync(dir);
    for (const f of ['plan.json', 'report.html']) copyFileSync(path.join(demoRuns().json.dir, f), path.join(dir, f));
    const paragraph = () => /<p class="proposal-text">(.*?)<\/p>/s.exec(readFileSync(path.join(dir, 'report.html'), 'utf8'))![1]!;
    expect(paragraph()).toMatch(/by the analytic limit, .* around Vira .* around Castell/);
    expect(paragraph()).not.toMatch(/Simulated blind searches/);
    const r = await runCliInProcess(['map', '--plan', path.join(dir, 'plan.json'), '--target', 'Vira', '--grid', '6x12', '--trials', '60']);
    expect(r.status).toBe(0);
    const text = paragraph();
    // Castell keeps the analytic limit; Vira's now comes from its map.
    const analytic = /by the analytic limit, (.*?visits\)\.)/.exec(text)![1]!;
    expect(analytic).toMatch(/around Castell \(14 visits\)\.$/);
    expect(analytic).not.toMatch(/Vira/);
    const map = JSON.parse(readFileSync(path.join(dir, 'map-vira.json'), 'utf8'));
    const detection: number[][] = map.panels[0].detection;
    const masses: number[] = map.msinisEarth;
    const words = (row: number[]) =>
      [0.5, 0.9].map((level) => {
        const m = firstCrossing(masses, row, level);
        return m === undefined ? (row[0]! >= level ? `below ${masses[0]!.toFixed(1)}` : `above ${masses.at(-1)!.toFixed(1)}`) : m.toFixed(1);
      });
    const [s50, s90] = words(detection[0]!);
    const [l50, l90] = words(detection.at(-1)!);
    expect(text).toContain(
      'Simulated blind searches of the planned visits (injection–recovery, `crest map`) detect 50% and 90% of planets at m sin i of ' +
        `${s50} and ${s90} M⊕ at 2 d and ${l50} and ${l90} M⊕ at 60 d around Vira (14 planned visits).`,
    );
  });
});

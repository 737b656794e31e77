// The report opened in a real browser: Debian's chromium (never a downloaded browser), driven by
// playwright-core. Skipped only on a developer machine without /usr/bin/chromium; in CI
// (process.env.CI set) it always runs, since .ci/run installs chromium.
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { renderReportHtml } from '../../src/report/html/report-html.js';
import { fixturePlan } from './fixture.js';

const CHROMIUM = '/usr/bin/chromium';
const skip = !existsSync(CHROMIUM) && !process.env.CI;
const title = skip ? `report in a browser (SKIPPED: ${CHROMIUM} is missing; install it with: apt-get install -y chromium)` : 'report in a browser';

describe.skipIf(skip)(title, () => {
  let context: BrowserContext;
  let profile: string;
  const outDir = path.resolve('test-output', 'report-browser');

  beforeAll(async () => {
    profile = mkdtempSync(path.join(os.tmpdir(), 'crest-chromium-'));
    // A fresh user-data dir per run (playwright passes it as --user-data-dir).
    context = await chromium.launchPersistentContext(profile, {
      executablePath: CHROMIUM,
      headless: true,
      viewport: { width: 1100, height: 900 },
      args: [
        '--headless',
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
      ],
    });
  });

  afterAll(async () => {
    await context?.close();
    rmSync(profile, { recursive: true, force: true });
  });

  it('opens from disk with no console error, every chart drawn at a non-zero size, each visit labelled, and a screenshot', async () => {
    const plan = fixturePlan();
    mkdirSync(outDir, { recursive: true });
    const file = path.join(outDir, 'report.html');
    writeFileSync(file, await renderReportHtml(plan));

    const page = await context.newPage();
    const errors: string[] = [];
    const requests: string[] = [];
    page.on('console', (msg) => {
      if (msg.type() === 'error') errors.push(msg.text());
    });
    page.on('pageerror', (err) => errors.push(err.message));
    page.on('request', (req) => requests.push(req.url()));
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });

    const sizes = await page.$$eval('figure.chart svg', (svgs) =>
      svgs.map((svg) => {
        const box = svg.getBoundingClientRect();
        return { width: box.width, height: box.height };
      }),
    );
    const figureCount = await page.locator('figure.chart').count();
    expect(figureCount).toBeGreaterThan(0);
    expect(sizes).toHaveLength(figureCount);
    for (const size of sizes) {
      expect(size.width).toBeGreaterThan(50);
      expect(size.height).toBeGreaterThan(50);
    }
    expect(errors).toEqual([]);
    // The page itself is the only thing loaded.
    expect(requests).toEqual([pathToFileURL(file).href]);

    // Every night chart, as the browser drew it: one thick segment per visit and a label naming its star.
    const nights = await page.$$eval('figure.chart-night', (figs) =>
      figs.map((f) => ({
        id: f.id,
        segments: f.querySelectorAll('g.visit_segments_marks path').length,
        labels: [...f.querySelectorAll('g.visit_labels_marks text')].map((t) => t.textContent ?? ''),
      })),
    );
    const dates = [...new Set(plan.visits.map((v) => v.localDate))].sort();
    expect(nights.map((n) => n.id)).toEqual(dates.map((d) => `night-${d}`));
    for (const [i, date] of dates.entries()) {
      const stars = plan.visits.filter((v) => v.localDate === date).map((v) => v.starId);
      expect(nights[i]!.segments).toBe(stars.length);
      expect([...nights[i]!.labels].sort()).toEqual([...stars].sort());
    }

    const shot = path.join(outDir, 'report.png');
    await page.screenshot({ path: shot, fullPage: true });
    expect(existsSync(shot)).toBe(true);
    await page.close();
  });
});

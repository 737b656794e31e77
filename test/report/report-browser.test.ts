/// <reference lib="dom" />
// DOM types for the functions that run in the page (page.evaluate); src/ is still built without them (tsconfig.build.json).
// The report opened in a real browser: Debian's chromium (never a downloaded browser), driven by
// playwright-core. Skipped only on a developer machine without /usr/bin/chromium; in CI
// (process.env.CI set) it always runs, since .ci/run installs chromium.
import { existsSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { savedMaps } from '../../src/cli/map-report.js';
import { PRINT_SIDE_MARGIN_MM } from '../../src/report/html/print-style.js';
import { renderReportHtml } from '../../src/report/html/report-html.js';
import { demoPlan } from '../support/demo-plan.js';
import { fixturePlan } from './fixture.js';
import { narrowLayout } from './narrow-layout.js';
import { pdfPages } from './pdf-pages.js';

const CHROMIUM = '/usr/bin/chromium';
const skip = !existsSync(CHROMIUM) && !process.env.CI;
/** The bound on the printed demo report. */
const MAX_PRINTED_PAGES = 10;
const PAPER = ['A4', 'Letter'] as const;
/** A4's width less the side margins, in CSS px (96 px to 25.4 mm, CSS Values 4). */
const A4_CONTENT_PX = ((210 - 2 * PRINT_SIDE_MARGIN_MM) * 96) / 25.4;

/** The demo as the README shows it: the plan `crest plan` writes, with the maps saved in demo-out. */
async function demoReport(): Promise<string> {
  const plan = demoPlan();
  return renderReportHtml(plan, savedMaps(plan, path.resolve('demo-out')));
}

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

  /** A page showing `html` (written to test-output under `name`), at `width` px. */
  async function open(name: string, html: string, width = 1100): Promise<Page> {
    mkdirSync(outDir, { recursive: true });
    const file = path.join(outDir, name);
    writeFileSync(file, html);
    const page = await context.newPage();
    await page.setViewportSize({ width, height: 900 });
    await page.goto(pathToFileURL(file).href, { waitUntil: 'load' });
    return page;
  }

  const reports = [
    ['fixture', async () => renderReportHtml(fixturePlan())],
    ['demo', demoReport],
  ] as const;

  for (const [name, render] of reports) {
    it(`prints the ${name} report on A4 and Letter in at most ${MAX_PRINTED_PAGES} numbered pages, the proposal summary alone on page 1`, async () => {
      const html = await render();
      const page = await open(`${name}-print.html`, html);
      for (const format of PAPER) {
        const pages = pdfPages(await page.pdf({ format }));
        expect(pages.pageObjects, format).toBe(pages.treeCount);
        expect(pages.pageObjects, format).toBeLessThanOrEqual(MAX_PRINTED_PAGES);
      }
      // Page numbers: Chromium parsed the bottom margin box of the @page rule.
      const marginBoxes = await page.evaluate(() =>
        [...document.styleSheets].flatMap((sheet) =>
          [...sheet.cssRules].flatMap((rule) => (rule instanceof CSSPageRule ? [...rule.cssRules].map((inner) => inner.cssText) : [])),
        ),
      );
      expect(marginBoxes.some((text) => text.startsWith('@bottom-center') && text.includes('counter(pages)'))).toBe(true);

      // Page 1: a forced break follows the summary, and the summary printed alone fills exactly one
      // page, so in the whole report nothing of it moves to page 2.
      await page.emulateMedia({ media: 'print' });
      expect(await page.$eval('.first-page', (el) => getComputedStyle(el).breakAfter)).toBe('page');
      await page.emulateMedia({ media: null });
      const first = await page.evaluate(() => {
        const section = document.querySelector<HTMLElement>('.first-page')!;
        while (section.nextSibling) section.nextSibling.remove();
        section.style.breakAfter = 'auto';
        return { caption: section.querySelector('table caption')?.textContent, paragraph: section.querySelector('.proposal-text') !== null };
      });
      expect(first).toEqual({ caption: 'Time request by target', paragraph: true });
      for (const format of PAPER) expect(pdfPages(await page.pdf({ format })).pageObjects, format).toBe(1);
      await page.close();

      // On A4's width no table runs past the page (in print the table boxes do not scroll).
      const printed = await open(`${name}-print.html`, html, Math.floor(A4_CONTENT_PX));
      await printed.emulateMedia({ media: 'print' });
      const overflowing = await printed.$$eval('.table-wrap', (boxes) =>
        boxes.filter((box) => !box.closest('details') && box.scrollWidth > box.clientWidth).map((box) => box.querySelector('caption')?.textContent),
      );
      expect(overflowing).toEqual([]);
      await printed.close();
    });

    it(`fits the ${name} report to a 390 px phone: no sideways page, wide boxes scroll with a hint, chart text >= 8 px`, async () => {
      const page = await open(`${name}-narrow.html`, await render(), 390);
      const layout = await narrowLayout(page);
      expect(layout.pageWidthPx).toBeLessThanOrEqual(390);
      expect(layout.wide.length).toBeGreaterThan(0);
      expect(layout.wide.filter((box) => !box.scrolls || !box.hint.includes('scroll sideways'))).toEqual([]);
      expect(layout.smallestChartTextPx).toBeGreaterThanOrEqual(8);
      await page.close();
    });
  }
});

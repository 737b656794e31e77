import { mkdirSync, writeFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Plan } from '../../src/plan/plan-schema.js';
import { renderReportHtml } from '../../src/report/html/report-html.js';
import { ADVISORY } from '../../src/report/plan-rows.js';
import { fixturePlan } from './fixture.js';
import { figures, markCount, tableRows } from './svg-marks.js';

let plan: Plan;
let page: string;

beforeAll(async () => {
  plan = fixturePlan();
  page = await renderReportHtml(plan);
  mkdirSync('test-output', { recursive: true });
  writeFileSync('test-output/report-fixture.html', page);
});

const visitsOf = (id: string) => plan.visits.filter((v) => v.starId === id).sort((a, b) => a.startUtc.localeCompare(b.startUtc));

describe('report.html is one self-contained file', () => {
  it('references nothing outside itself', () => {
    // SVG namespace names are identifiers, not references: drop them, then no URL may remain.
    const withoutNamespaces = page.replace(/xmlns(:xlink)?="http:\/\/www\.w3\.org\/[^"]*"/g, '');
    expect(withoutNamespaces).not.toMatch(/https?:\/\//i);
    expect(page).not.toMatch(/\b(src|href)\s*=/i);
    expect(page).not.toMatch(/@import/i);
    // The only url() allowed points inside the page (a clip path), and its target exists once.
    expect(page).not.toMatch(/url\(\s*['"]?(?!#)/i);
    const ids = [...page.matchAll(/\bid="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length);
    for (const m of page.matchAll(/url\(#([^)]+)\)/g)) expect(ids).toContain(m[1]);
    expect(page).not.toMatch(/<(script|link|img|iframe|object)\b/i);
  });

  it('is a complete HTML document with its style inline and the advisory caution', () => {
    expect(page.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(page).toContain('<style>');
    expect(page).toContain('@page');
    expect(page).toContain('break-inside: avoid');
    expect(page).toContain(ADVISORY.replace(/'/g, '&#39;'));
  });

  it('shows and speaks no underscore of a subscript: σ_K nowhere in text or aria-labels', () => {
    const text = page.replace(/<style>[\s\S]*?<\/style>/g, '').replace(/<[^>]*>/g, ' ');
    expect(text).not.toMatch(/(σ|sigma)_[A-Za-z]/);
    const labels = [...page.matchAll(/aria-label="([^"]*)"/g)].map((m) => m[1]!);
    expect(labels.length).toBeGreaterThan(0);
    expect(labels.filter((l) => /(σ|sigma)_/.test(l))).toEqual([]);
  });

  it('is the same bytes when rendered again in the same process', async () => {
    expect(await renderReportHtml(plan)).toBe(page);
  });

  it('gives every chart a title, a caption and a data table', () => {
    const all = figures(page, '[a-z-]+');
    expect(all.length).toBeGreaterThan(0);
    for (const f of all) {
      expect(f.html).toMatch(/<svg[^>]*width="\d+"/);
      expect(f.html).toMatch(/<figcaption id="[^"]+"><strong>.+?\.<\/strong> \S/);
      expect(f.html).toMatch(/<details><summary>Data table<\/summary><div class="table-wrap[^"]*"><table>/);
      expect(f.html).toContain('role-title-text');
    }
  });
});

describe('the charts hold one mark per planned item', () => {
  it('calendar: one symbol per visit, one column per planned or backup night, one Moon bar per night', () => {
    const [calendar] = figures(page, 'calendar');
    expect(calendar).toBeDefined();
    expect(markCount(calendar!.html, 'calendar_visits')).toBe(plan.visits.length);
    expect(markCount(calendar!.html, 'planned_nights')).toBe(plan.plannedDates.length);
    expect(markCount(calendar!.html, 'backup_nights')).toBe(plan.backups.length);
    expect(markCount(calendar!.html, 'moon_bars')).toBe(plan.nights.length);
  });

  it('nights: one chart per night with visits, one segment and one label per visit, one altitude track per star', () => {
    const nights = figures(page, 'night');
    const dates = [...new Set(plan.visits.map((v) => v.localDate))].sort();
    expect(nights.map((n) => n.id)).toEqual(dates.map((d) => `night-${d}`));
    for (const [i, date] of dates.entries()) {
      const visits = plan.visits.filter((v) => v.localDate === date);
      expect(markCount(nights[i]!.html, 'visit_segments')).toBe(visits.length);
      expect(markCount(nights[i]!.html, 'visit_labels')).toBe(visits.length);
      expect(markCount(nights[i]!.html, 'altitude_lines')).toBe(new Set(visits.map((v) => v.starId)).size);
      // The sky strip: one five-minute step after another across the drawn span (at least a 6 h night).
      expect(markCount(nights[i]!.html, 'sky_strip')).toBeGreaterThanOrEqual(72);
    }
  });

  it('RV phase: per ephemeris target, one point with two error bars per visit', () => {
    const ephemeris = plan.targets.filter((t) => t.kind === 'ephemeris' && t.visits > 0);
    const charts = figures(page, 'rv-phase');
    expect(charts).toHaveLength(ephemeris.length);
    for (const [i, t] of ephemeris.entries()) {
      const n = visitsOf(t.targetId).length;
      expect(markCount(charts[i]!.html, 'visit_points')).toBe(n);
      expect(markCount(charts[i]!.html, 'rv_error_bars')).toBe(n);
      expect(markCount(charts[i]!.html, 'phase_error_bars')).toBe(n);
      expect(markCount(charts[i]!.html, 'model_curve')).toBe(1);
    }
  });

  it('mass limit: one curve and one goal line per blind-search target with visits', () => {
    const charts = figures(page, 'mass-limit');
    expect(charts.map((c) => c.id)).toEqual(plan.targets.filter((t) => t.kind === 'search' && t.visits >= 2).map((t) => `mass-${t.targetId.toLowerCase()}`));
    for (const c of charts) {
      expect(markCount(c.html, 'mass_limit_line')).toBe(1);
      expect(markCount(c.html, 'goal_mass')).toBe(1);
    }
  });
});

describe('numbers recomputed from the visits', () => {
  /**
   * Slow reference: weighted least squares for v = γ + K s with s = −sin 2πφ (docs/references.md
   * [Kepler-RV]); Var(K̂) is the (K, K) element of the inverse 2×2 normal matrix. The fixture's
   * phase errors are below 0.003 cycles, so the expected information differs from this by < 0.1%.
   */
  function referenceKOverSigmaK(kMps: number, n: number, targetId: string): number {
    let sw = 0,
      sws = 0,
      swss = 0;
    for (const v of visitsOf(targetId).slice(0, n)) {
      const w = 1 / v.effectiveSigmaMps ** 2;
      const s = -Math.sin(2 * Math.PI * v.phases[0]!.phase);
      sw += w;
      sws += w * s;
      swss += w * s * s;
    }
    const det = sw * swss - sws * sws;
    return det > 0 ? kMps / Math.sqrt(sw / det) : 0;
  }

  it('K/σ_K after each visit matches weighted least squares and never falls', () => {
    const charts = figures(page, 'k-growth');
    const ephemeris = plan.targets.filter((t) => t.kind === 'ephemeris' && t.visits > 0);
    expect(charts).toHaveLength(ephemeris.length);
    for (const [i, t] of ephemeris.entries()) {
      const rows = tableRows(charts[i]!.html);
      expect(rows).toHaveLength(t.visits);
      expect(markCount(charts[i]!.html, 'k_growth_points')).toBe(t.visits);
      expect(markCount(charts[i]!.html, 'goal_line')).toBe(1);
      const values = rows.map((r) => Number(r[2]));
      values.forEach((value, j) => {
        expect(value).toBeCloseTo(referenceKOverSigmaK(t.kMps!, j + 1, t.targetId), 1);
      });
      for (let j = 1; j < values.length; j++) expect(values[j]!).toBeGreaterThanOrEqual(values[j - 1]!);
    }
  });

  it('mass limit grows as P^(1/3) for a planet much lighter than its star (common practice)', () => {
    const [chart] = figures(page, 'mass-limit');
    const rows = tableRows(chart!.html).map((r) => r.map(Number));
    const [p1, , m1] = rows[0]!;
    const [p2, , m2] = rows[rows.length - 1]!;
    expect(m2! / m1!).toBeCloseTo((p2! / p1!) ** (1 / 3), 2);
  });

  it('the calendar table lists planned and backup nights with their visits', () => {
    const rows = tableRows(figures(page, 'calendar')[0]!.html);
    expect(rows.filter((r) => r[1] === 'planned').map((r) => r[0])).toEqual([...plan.plannedDates].sort());
    expect(
      rows
        .filter((r) => r[1]!.startsWith('backup'))
        .map((r) => r[0])
        .sort(),
    ).toEqual(plan.backups.map((b) => b.localDate).sort());
    const listed = rows.flatMap((r) => (r[3] === '-' ? [] : r[3]!.split(', ')));
    expect(listed).toHaveLength(plan.visits.length);
  });
});

describe('proposal summary', () => {
  it('has one row per target, a dash where a target has no visits', () => {
    const section = page.slice(page.indexOf('id="proposal"'), page.indexOf('id="calendar-section"'));
    const rows = tableRows(section);
    expect(rows.map((r) => r[0])).toEqual(plan.targets.map((t) => t.targetId));
    const idle = rows.find((r) => r[0] === 'Quena-2')!;
    expect(idle[3]).toBe('-');
    expect(idle[9]).toBe('0');
  });

  it('fills the paragraph with the plan totals', () => {
    const text = page.slice(page.indexOf('<p class="proposal-text">'), page.indexOf('</p>', page.indexOf('<p class="proposal-text">')));
    expect(text).toContain(`We request ${plan.totals.nights} nights`);
    expect(text).toContain(`${plan.totals.visits} radial-velocity visits`);
    expect(text).toContain(`${plan.totals.totalHours.toFixed(1)} h in total`);
    expect(text).toContain(`${plan.backups.length} backup nights`);
    expect(text).toMatch(/m sin i of \d+\.\d M⊕ at 2 d and \d+\.\d M⊕ at 40 d around Alba \(3 visits\)/);
  });
});

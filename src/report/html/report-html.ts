import type { SearchSpec, Target } from '../../model.js';
import type { Plan, TargetSummary } from '../../plan/plan-schema.js';
import { ADVISORY, requestLine, targetColumns, targetNotes, targetRows, targetRvUpdateLines, totalsLine, visitsByNight } from '../plan-rows.js';
import { calendarFigure } from './chart-calendar.js';
import { detectionMapFigure, type DetectionMapData } from './chart-detection-map.js';
import { kGrowthFigure } from './chart-k-growth.js';
import { massLimitFigure } from './chart-mass-limit.js';
import { nightFigure } from './chart-night.js';
import { nightsSweepFigure } from './chart-nights-sweep.js';
import { rvPhaseFigure } from './chart-rv-phase.js';
import { renderFigure } from './figure.js';
import { escapeHtml, htmlText, scrollTable } from './html.js';
import { NARROW_CSS } from './narrow-style.js';
import { PAGE_CSS } from './page-style.js';
import { PRINT_CSS } from './print-style.js';
import { PROPOSAL_COLUMNS, proposalParagraph, proposalRows } from './proposal-summary.js';
import { targetOf } from './target-visits.js';

const hasK = (s: TargetSummary): s is TargetSummary & { kMps: number } => s.kMps !== undefined && s.kMps > 0;

function head(plan: Plan): string {
  const c = plan.campaign;
  const facts: [string, string][] = [
    ['Site', `${c.site.name} (${c.site.latitudeDeg.toFixed(4)}°, ${c.site.longitudeDeg.toFixed(4)}°, ${c.site.elevationM} m; ${c.site.timeZone})`],
    ['Instrument', c.instrument.name],
    ['Window', `${c.window.start} to ${c.window.end}`],
    ['Constraints', `${c.constraints.twilight} twilight, airmass ≤ ${c.constraints.maxAirmass}, Moon ≥ ${c.constraints.moonSeparationDeg}°`],
    ['Plan', totalsLine(plan)],
    ...(requestLine(plan) ? [['Request', requestLine(plan)!] as [string, string]] : []),
  ];
  return [
    '<header class="report-head">',
    `<h1>${escapeHtml(c.name)}</h1>`,
    `<dl class="facts">${facts.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${escapeHtml(v)}</dd>`).join('')}</dl>`,
    '</header>',
    `<p class="caution" role="note"><strong>Caution.</strong> ${escapeHtml(ADVISORY)}</p>`,
  ].join('\n');
}

/** What the RVs so far changed for one target (its fit or its search peak), as a paragraph; '' without RVs. */
function rvUpdateParagraph(plan: Plan, s: TargetSummary): string {
  const lines = targetRvUpdateLines(plan, s);
  return lines.length ? `<p class="rv-update"><strong>RVs so far:</strong> ${lines.map(htmlText).join('<br>')}</p>` : '';
}

async function targetSections(plan: Plan, maps: ReadonlyMap<string, DetectionMapData>): Promise<string[]> {
  const out: string[] = [];
  const ephemeris = plan.targets.filter((s) => s.kind === 'ephemeris' && s.visits > 0 && hasK(s)) as (TargetSummary & { kMps: number })[];
  if (ephemeris.length) {
    out.push('<h2 id="orbits">Orbital phase coverage</h2>');
    for (const s of ephemeris) {
      out.push(
        '<section class="planet-block">',
        `<h3>${escapeHtml(s.targetId)}</h3>`,
        ...[rvUpdateParagraph(plan, s)].filter(Boolean),
        '<div class="pair">',
        await renderFigure(rvPhaseFigure(plan, s)),
        await renderFigure(kGrowthFigure(plan, s)),
        '</div>',
        '</section>',
      );
    }
  }
  const search = plan.targets.flatMap((s) => {
    const target = targetOf(plan, s.targetId);
    return s.kind === 'search' && target?.search ? [{ s, target: target as Target & { search: SearchSpec } }] : [];
  });
  const parts = search.map(({ s, target }) => {
    const figure = massLimitFigure(plan, s, target);
    const map = maps.get(s.targetId);
    return { text: rvUpdateParagraph(plan, s), figures: [...(figure ? [figure] : []), ...(map ? [detectionMapFigure(map)] : [])] };
  });
  if (parts.some((p) => p.text || p.figures.length)) {
    out.push('<h2 id="search">Blind-search sensitivity</h2>', '<div class="search-blocks">');
    for (const part of parts) {
      out.push('<section class="search-block">', ...[part.text].filter(Boolean));
      for (const figure of part.figures) out.push(await renderFigure(figure));
      out.push('</section>');
    }
    out.push('</div>');
  }
  return out;
}

const tableNotes = (plan: Plan) => targetNotes(plan).map((note) => `<p class="table-note">${htmlText(note)}</p>`);

function warnings(plan: Plan): string {
  const all = [...plan.warnings, ...plan.targets.flatMap((t) => t.warnings.map((w) => `${t.targetId}: ${w}`))];
  if (!all.length) return '';
  return `<h2 id="warnings">Warnings</h2>\n<ul class="warnings">${[...new Set(all)].map((w) => `<li>${htmlText(w)}</li>`).join('')}</ul>`;
}

/**
 * report.html: the whole plan as one self-contained page (inline CSS and SVG charts, no scripts,
 * no external references), readable on screen and on a phone, and printable on A4 or US Letter
 * with the proposal summary on page 1. `maps` (by target
 * id, from `crest map`) adds a detection-probability map to a blind-search target's section.
 */
export async function renderReportHtml(plan: Plan, maps: ReadonlyMap<string, DetectionMapData> = new Map()): Promise<string> {
  const body: string[] = [
    '<section class="first-page">',
    head(plan),
    '<h2 id="proposal">Proposal summary</h2>',
    scrollTable(PROPOSAL_COLUMNS, proposalRows(plan), 'Time request by target'),
    ...tableNotes(plan),
    `<p class="proposal-text">${htmlText(proposalParagraph(plan, maps))}</p>`,
    '</section>',
    '<h2 id="calendar-section">Campaign calendar</h2>',
    await renderFigure(calendarFigure(plan)),
    ...(plan.nightsSweep?.length
      ? ['<h2 id="sweep-section">How many nights</h2>', await renderFigure(nightsSweepFigure(plan.nightsSweep, plan.campaign.goals.probability))]
      : []),
    '<h2 id="nights">Planned nights</h2>',
    '<div class="chart-grid">',
  ];
  for (const [date, visits] of visitsByNight(plan)) {
    if (visits.length) body.push(await renderFigure(nightFigure(plan, date, visits)));
  }
  body.push('</div>');
  body.push(...(await targetSections(plan, maps)));
  body.push(
    '<h2 id="detectability">Detectability of every target</h2>',
    scrollTable(targetColumns(plan), targetRows(plan), 'Expected result per target'),
    ...tableNotes(plan),
    warnings(plan),
    `<footer>Written by ${escapeHtml(plan.generator)} from plan schema version ${plan.schemaVersion}. ` +
      'Chart colours: the Okabe–Ito palette first (Okabe & Ito 2008, Color Universal Design), safe for common colour-vision deficiencies; ' +
      'past eight stars, generated colours, and every visit labelled with its star.</footer>',
  );
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<title>${escapeHtml(plan.campaign.name)}: observing plan</title>`,
    `<style>${PAGE_CSS}${PRINT_CSS}${NARROW_CSS}</style>`,
    '</head>',
    '<body><main>',
    ...body.filter((part) => part !== ''),
    '</main></body>',
    '</html>',
    '',
  ].join('\n');
}

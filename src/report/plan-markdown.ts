import type { Plan } from '../plan/plan-schema.js';
import { sweepColumns, sweepRows, sweepTitle } from './sweep-rows.js';
import { markdownTable } from './markdown.js';
import {
  ADVISORY,
  historyLine,
  rvUpdateLines,
  nightHeading,
  targetNotes,
  requestLine,
  OBSERVED_COLUMNS,
  observedRows,
  targetColumns,
  targetRows,
  totalsLine,
  VISIT_COLUMNS,
  visitRow,
  visitsByNight,
} from './plan-rows.js';

/** plan.md: the plan for people. */
export function renderPlanMarkdown(plan: Plan): string {
  const c = plan.campaign;
  const zone = c.site.timeZone;
  const out: string[] = [
    `# ${c.name}`,
    '',
    `- Site: ${c.site.name} (${c.site.latitudeDeg.toFixed(4)}°, ${c.site.longitudeDeg.toFixed(4)}°, ${c.site.elevationM} m; ${zone})`,
    `- Instrument: ${c.instrument.name}`,
    `- Window: ${c.window.start} to ${c.window.end}; ` +
      `twilight ${c.constraints.twilight}, airmass ≤ ${c.constraints.maxAirmass}, Moon ≥ ${c.constraints.moonSeparationDeg}°`,
    `- ${totalsLine(plan)}`,
    ...(requestLine(plan) ? [`- ${requestLine(plan)}`] : []),
    ...(historyLine(plan) ? [`- ${historyLine(plan)}`] : []),
    '',
    `> ${ADVISORY}`,
    '',
    '## Targets',
    '',
    markdownTable(targetColumns(plan), targetRows(plan)),
    '',
    ...targetNotes(plan).flatMap((note) => [note, '']),
    ...(plan.observed?.length ? ['## Visits already made', '', markdownTable(OBSERVED_COLUMNS, observedRows(plan)), ''] : []),
    ...(rvUpdateLines(plan).length ? ['## What the RVs so far change', '', ...rvUpdateLines(plan).map((l) => `- ${l}`), ''] : []),
    ...(plan.nightsSweep?.length
      ? [
          '## How many nights',
          '',
          `${sweepTitle(plan)}.`,
          '',
          markdownTable(sweepColumns(plan.nightsSweep), sweepRows(plan.nightsSweep, plan.campaign.goals.probability)),
          '',
        ]
      : []),
    '## Nights',
    '',
  ];
  for (const [date, visits] of visitsByNight(plan)) {
    out.push(`### ${nightHeading(plan, date)}`, '');
    out.push(
      visits.length
        ? markdownTable(
            VISIT_COLUMNS,
            visits.map((v) => visitRow(v, zone)),
          )
        : '(no visit)',
      '',
    );
  }
  if (plan.backups.length) {
    out.push('## Backup nights', '', ...plan.backups.map((b) => `${b.rank}. ${b.localDate} (utility gain ${b.utilityGain.toFixed(3)})`), '');
  }
  const warnings = [...plan.warnings, ...plan.targets.flatMap((t) => t.warnings.map((w) => `${t.targetId}: ${w}`))];
  if (warnings.length) out.push('## Warnings', '', ...warnings.map((w) => `- ${w}`), '');
  return out.join('\n');
}

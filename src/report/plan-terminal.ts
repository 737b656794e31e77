import type { Plan } from '../plan/plan-schema.js';
import { sweepColumns, sweepRows, sweepTitle } from './sweep-rows.js';
import { renderTable } from './table.js';
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

/** The plain-text summary printed by `crest plan`. */
export function renderPlanText(plan: Plan): string {
  const c = plan.campaign;
  const zone = c.site.timeZone;
  const out: string[] = [
    `${c.name}: ${c.site.name}, ${c.instrument.name}`,
    `Window ${c.window.start} to ${c.window.end}; times in ${zone} and UTC.`,
    ...(historyLine(plan) ? [historyLine(plan)!] : []),
    '',
  ];
  if (plan.observed?.length) out.push('Visits already made', renderTable(OBSERVED_COLUMNS, observedRows(plan)), '');
  const updates = rvUpdateLines(plan);
  if (updates.length) out.push('What the RVs so far change', ...updates.map((l) => `- ${l}`), '');
  for (const [date, visits] of visitsByNight(plan)) {
    out.push(nightHeading(plan, date));
    out.push(
      visits.length
        ? indent(
            renderTable(
              VISIT_COLUMNS,
              visits.map((v) => visitRow(v, zone)),
            ),
          )
        : '  (no visit)',
    );
    out.push('');
  }
  if (plan.backups.length) {
    out.push(`Backup nights, best first: ${plan.backups.map((b) => b.localDate).join(', ')}`, '');
  }
  out.push('Targets', renderTable(targetColumns(plan), targetRows(plan)), ...targetNotes(plan), '');
  out.push(totalsLine(plan), ...(requestLine(plan) ? [requestLine(plan)!] : []));
  if (plan.nightsSweep?.length)
    out.push('', sweepTitle(plan), renderTable(sweepColumns(plan.nightsSweep), sweepRows(plan.nightsSweep, plan.campaign.goals.probability)));
  const warnings = [...plan.warnings, ...plan.targets.flatMap((t) => t.warnings.map((w) => `${t.targetId}: ${w}`))];
  if (warnings.length) out.push('', 'Warnings', ...warnings.map((w) => `- ${w}`));
  out.push('', ADVISORY);
  return out.join('\n');
}

function indent(text: string): string {
  return text
    .split('\n')
    .map((line) => `  ${line}`)
    .join('\n');
}

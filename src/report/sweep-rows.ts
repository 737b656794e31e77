// The nights sweep as a table (terminal, plan.md, report): one column per night count, one row
// per quantity, then one row per goal, so that many targets still fit a screen.
import type { Plan, SweepRow } from '../plan/plan-schema.js';
import { type Column, fmt, percent } from './table.js';

/** The heading line of the sweep, with how each count was planned. */
export function sweepTitle(plan: Plan): string {
  const own = plan.campaign.time.mode === 'choose-nights' ? `; the plan above asks for ${plan.campaign.time.nights}` : '';
  return `How many nights: the campaign planned in full for each count, P with the site's weather${own}`;
}

export function sweepColumns(sweep: SweepRow[]): Column[] {
  return [{ header: 'nights' }, ...sweep.map((r) => ({ header: String(r.nights), align: 'right' as const }))];
}

/** The sweep's rows; q is the campaign's goal probability (time from need). */
export function sweepRows(sweep: SweepRow[], q: number): string[][] {
  const row = (label: string, cell: (r: SweepRow) => string) => [label, ...sweep.map(cell)];
  const ids = sweep[0]?.goals.map((g) => g.targetId) ?? [];
  return [
    row('visits', (r) => String(r.visits)),
    row('hours used', (r) => fmt(r.totalHours, 1)),
    row('dark hours', (r) => fmt(r.darkHours, 1)),
    row('idle dark hours', (r) => fmt(r.idleHours, 1)),
    row('P(all goals)', (r) => percent(r.allGoalsProbability)),
    ...(sweep.every((r) => r.requestedVisits !== undefined)
      ? [
          row('visits requested', (r) => String(r.requestedVisits)),
          row('hours requested', (r) => fmt(r.requestedHours, 1)),
          row(`goals at ${percent(q)}`, (r) => `${r.goalsAtProbability} of ${r.goals.length}`),
        ]
      : []),
    ...ids.map((id) => row(`P(goal) ${id}`, (r) => percent(r.goals.find((g) => g.targetId === id)?.goalProbability))),
  ];
}

// What the two search-versus-random test files share: a check's line and its assertion.
import { expect } from 'vitest';
import type { SearchCheck } from './search-check.js';

/** One check as a line of the test output. */
function line(c: SearchCheck): string {
  const part = (m: SearchCheck['random']) => (m ? `${m.r.toFixed(3)} (planned − random ${m.diff.toFixed(3)} ± ${m.se.toFixed(3)})` : 'no random set fits');
  return (
    `${c.targetId}: ${c.visits} visits, analytic ${c.claimed.toFixed(3)}, injected ${(c.planned.detected / c.planned.trials).toFixed(3)}; ` +
    `random in the window ${part(c.random)}; random on the plan's nights ${part(c.randomPlanNights)}`
  );
}

/** Each check as a line of the test output. */
export function printChecks(checks: SearchCheck[]): void {
  for (const c of checks) console.log(line(c));
}

/** Planned minus random above three standard errors for every check (and at least one check). */
export function expectMargin(checks: SearchCheck[]): void {
  expect(checks.length).toBeGreaterThan(0);
  printChecks(checks);
  for (const c of checks) {
    expect(c.random).toBeDefined();
    expect(c.random!.diff).toBeGreaterThan(3 * c.random!.se);
  }
}

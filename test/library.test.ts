// The library entry point (package "exports" → dist/index.js), through the README's example.
import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { demoPlan } from './support/demo-plan.js';

describe('examples/library.mjs (imports the built package by name)', () => {
  it('prints K from the handy form and the demo plan computed in-process', () => {
    const out = execFileSync(process.execPath, ['examples/library.mjs'], { encoding: 'utf8' }).trim().split('\n');
    // K = 28.4329 m/s (m sin i / M_Jup)(M*/M_sun)^(-2/3)(P/1 yr)^(-1/3) for m << M* (docs/references.md [K-handy-form]):
    // 10 M_earth = 10/317.83 M_Jup around 0.8 M_sun on 20 d.
    const handy = 28.4329 * (10 / 317.83) * 0.8 ** (-2 / 3) * (20 / 365.25) ** (-1 / 3);
    expect(Number(/: ([\d.]+) m\/s$/.exec(out[0]!)![1])).toBeCloseTo(handy, 2);
    // The demo plan as `crest plan` wrote it (the shared run of test/support/demo-plan.ts).
    const plan = demoPlan();
    expect(out.slice(1)).toEqual(
      plan.targets.map((t) => `${t.targetId.padEnd(9)} ${String(t.visits).padStart(3)} visits  K/sigma_K ${t.kOverSigmaK?.toFixed(1) ?? '-'}`),
    );
  });
});

// Vitest global setup: `crest plan` on the bundled demo, run once per test run (two runs side by
// side, the second with --json) into a temporary folder, so that the tests that read the demo plan
// share one computation instead of each building it again.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';
import { runCliAsync } from '../cli/run-cli.js';
import type { DemoRuns } from './demo-plan.js';

export default async function setup(project: TestProject): Promise<() => void> {
  const root = mkdtempSync(path.join(tmpdir(), 'crest-demo-'));
  const summaryDir = path.join(root, 'summary');
  const jsonDir = path.join(root, 'json');
  const [summary, json] = await Promise.all([runCliAsync(['plan', '--out', summaryDir]), runCliAsync(['plan', '--out', jsonDir, '--json'])]);
  const runs: DemoRuns = { summary: { dir: summaryDir, result: summary }, json: { dir: jsonDir, result: json } };
  project.provide('demoRuns', runs);
  return () => rmSync(root, { recursive: true, force: true });
}

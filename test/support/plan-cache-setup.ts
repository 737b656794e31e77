// Vitest global setup: an empty folder for the run's shared plans (test/support/plan-cache.ts),
// removed when the run ends.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { TestProject } from 'vitest/node';

export default function setup(project: TestProject): () => void {
  const dir = mkdtempSync(path.join(tmpdir(), 'crest-plans-'));
  project.provide('planCacheDir', dir);
  return () => rmSync(dir, { recursive: true, force: true });
}

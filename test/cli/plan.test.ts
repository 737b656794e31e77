import { describe, expect, it } from 'vitest';
import { runCli } from './run-cli.js';

describe('crest plan on the bundled demo', () => {
  it('exits 0 and names the demo targets', () => {
    const r = runCli(['plan']);
    expect(r.status).toBe(0);
    expect(r.stderr).toBe('');
    expect(r.stdout).toContain('SELVA-12');
  });

  it('--json prints one JSON document', () => {
    const r = runCli(['plan', '--json']);
    expect(r.status).toBe(0);
    expect(() => JSON.parse(r.stdout)).not.toThrow();
  });
});

import { readdirSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { SOURCED_FIELDS } from '../../src/io/instrument.js';
import { runCliInProcess } from './run-cli.js';

const PROFILE_FILES = readdirSync(new URL('../../sites/instruments/', import.meta.url)).filter((f) => f.endsWith('.json'));

interface Listed {
  id: string;
  band: string;
  reference: { photonSigmaMps: number; mag: number };
  sources: Record<string, string>;
  sourceNote: string;
}

describe('crest instruments', () => {
  it('lists every bundled profile once, each number with a source note', async () => {
    const r = await runCliInProcess(['instruments', '--json']);
    expect(r.status).toBe(0);
    const listed = JSON.parse(r.stdout) as Listed[];
    expect(listed.map((i) => `${i.id}.json`).sort()).toEqual([...PROFILE_FILES].sort());
    for (const i of listed) {
      expect(i.sourceNote.length).toBeGreaterThan(0);
      for (const field of SOURCED_FIELDS) expect(i.sources[field], `${i.id} ${field}`).toBeTruthy();
    }
  });

  it('prints one row per profile with its reference point, then one source line each', async () => {
    const r = await runCliInProcess(['instruments']);
    expect(r.status).toBe(0);
    const listed = JSON.parse((await runCliInProcess(['instruments', '--json'])).stdout) as Listed[];
    const lines = r.stdout.split('\n');
    expect(lines[0]).toMatch(/^id\s+aperture \(m\)\s+R\s+region, nm/);
    for (const i of listed) {
      const row = lines.find((l) => l.startsWith(`${i.id} `));
      expect(row).toContain(`${i.reference.photonSigmaMps.toFixed(2)} at ${i.band} = ${i.reference.mag.toFixed(1)}`);
      expect(lines.some((l) => l.startsWith(`${i.id}: `))).toBe(true);
    }
  });
});

import { describe, expect, it } from 'vitest';
import { runCliInProcess } from './run-cli.js';

describe('crest sites', () => {
  it('lists at least eight valid bundled sites in both hemispheres', async () => {
    // Every bundled file passes the site schema, or the command would exit 2.
    const r = await runCliInProcess(['sites', '--json']);
    expect(r.status).toBe(0);
    const sites = JSON.parse(r.stdout) as { id: string; latitudeDeg: number; longitudeDeg: number; timeZone: string; sourceNote: string }[];
    expect(sites.length).toBeGreaterThanOrEqual(8);
    expect(sites.some((s) => s.latitudeDeg > 0)).toBe(true);
    expect(sites.some((s) => s.latitudeDeg < 0)).toBe(true);
    for (const s of sites) expect(s.sourceNote.length).toBeGreaterThan(0);
    expect(new Set(sites.map((s) => s.id)).size).toBe(sites.length);
  });

  it('prints a table with one row per site', async () => {
    const r = await runCliInProcess(['sites']);
    expect(r.status).toBe(0);
    const ids = (JSON.parse((await runCliInProcess(['sites', '--json'])).stdout) as { id: string }[]).map((s) => s.id);
    const lines = r.stdout.trim().split('\n');
    expect(lines[0]).toMatch(/^id\s+name\s+lat \(deg\)/);
    expect(lines.length).toBe(ids.length + 2); // header and rule
    for (const id of ids) expect(r.stdout).toContain(id);
    // Each row ends in the site's median zenith seeing (Paranal's 0.66 arcsec: ESO's DIMM survey, [INGSites]).
    expect(lines.find((l) => l.startsWith('paranal '))).toMatch(/ 0\.66$/);
    expect(lines[0]).toMatch(/seeing \(arcsec\)$/);
  });
});

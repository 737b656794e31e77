// Output sets in a folder shared between machines (map parts written by cluster jobs): a staging
// folder of another machine's run is never removed, since its writer cannot be asked whether it
// still runs; a dead run's on this machine is, in the current name form and the older one; and a
// commit that another run finishes first still ends with every file in place.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { hostname, tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { recoverOutputSets, writeOutputSet } from '../../src/io/output-set.js';

const fresh = () => mkdtempSync(path.join(tmpdir(), 'crest-hosts-'));

/** The pid of a process that has ended. */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', 'console.log(process.pid)'], { encoding: 'utf8' });
  return Number(child.stdout.trim());
}

function folderWithFile(dir: string, name: string): string {
  const at = path.join(dir, name);
  mkdirSync(at);
  writeFileSync(path.join(at, 'plan.md'), 'half written');
  return at;
}

describe('output sets on a shared folder', () => {
  it("leaves another machine's staging folder, removes this machine's dead ones", () => {
    const dir = fresh();
    const dead = deadPid();
    const host = hostname().replace(/[^A-Za-z0-9.-]/g, '_');
    const foreign = folderWithFile(dir, `.crest-staging-${dead}@node-17.cluster-x-Ab12Cd`);
    const mineDead = folderWithFile(dir, `.crest-staging-${dead}@${host}-Ef34Gh`);
    const olderForm = folderWithFile(dir, `.crest-staging-${dead}-Ij56Kl`);
    writeOutputSet(dir, { 'map-shard-0-of-2.json': '{}' }, []);
    expect(existsSync(foreign)).toBe(true);
    expect(existsSync(mineDead)).toBe(false);
    expect(existsSync(olderForm)).toBe(false);
    expect(readdirSync(dir).sort()).toEqual([path.basename(foreign), 'map-shard-0-of-2.json']);
  });

  it('a commit finished by another run meanwhile still puts every file in place', () => {
    const dir = fresh();
    const files = { 'a.txt': 'A', 'b.txt': 'B' };
    // Right after the commit step, another run tidies the folder and so moves this run's files.
    writeOutputSet(dir, files, [], { afterStep: (step) => step === 'committed' && recoverOutputSets(dir) });
    expect(readdirSync(dir).sort()).toEqual(['a.txt', 'b.txt']);
    expect(readFileSync(path.join(dir, 'b.txt'), 'utf8')).toBe('B');
  });
});

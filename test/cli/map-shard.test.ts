// `crest map --shard i/n` and `--merge` on the demo plan (two blind-search stars, eleven ephemeris
// targets): the merged files and printed text equal one run's byte for byte for n = 1, 2 and 3,
// and parts that do not belong to the run are refused with one line.
import { copyFileSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { demoRuns } from '../support/demo-plan.js';
import { runCliInProcess, tempFiles } from './run-cli.js';

const small = ['--grid', '4x3', '--trials', '30', '--seed', '5'];
const PART = /^map-shard-\d+-of-\d+\.json$/;

let root: string;
/** A folder holding a copy of the demo plan.json. */
function withPlan(name: string): { dir: string; plan: string } {
  const dir = path.join(root, name);
  mkdirSync(dir);
  const plan = path.join(dir, 'plan.json');
  copyFileSync(path.join(demoRuns().json.dir, 'plan.json'), plan);
  return { dir, plan };
}

/** Every file of a folder except the parts, name → bytes. */
function outputs(dir: string): Map<string, Buffer> {
  return new Map(
    readdirSync(dir)
      .filter((n) => !PART.test(n))
      .sort()
      .map((n) => [n, readFileSync(path.join(dir, n))]),
  );
}

async function ok(args: string[]): Promise<string> {
  const r = await runCliInProcess(args);
  expect(r.stderr).toBe('');
  expect(r.status).toBe(0);
  return r.stdout;
}

async function shardedRun(name: string, count: number, extra: string[] = []): Promise<{ dir: string; plan: string; stdout: string }> {
  const { dir, plan } = withPlan(name);
  for (let i = 0; i < count; i++) await ok(['map', '--plan', plan, ...small, '--shard', `${i}/${count}`]);
  const stdout = await ok(['map', '--plan', plan, ...small, ...extra, '--merge']);
  return { dir, plan, stdout };
}

/** One run without parts: its folder, printed text, and JSON document (its folder as <out>). */
let single: { dir: string; stdout: string; json: string };
beforeAll(async () => {
  root = tempFiles({});
  const { dir, plan } = withPlan('single');
  const stdout = await ok(['map', '--plan', plan, ...small]);
  const other = withPlan('single-json');
  const json = await ok(['map', '--plan', other.plan, ...small, '--json']);
  single = { dir, stdout, json: json.replaceAll(other.dir, '<out>') };
});

describe('crest map --shard / --merge', () => {
  for (const count of [1, 2, 3]) {
    it(`${count} part(s) merged equal one run, byte for byte`, async () => {
      const run = await shardedRun(`parts-${count}`, count);
      expect(run.stdout.replaceAll(run.dir, '<out>')).toBe(single.stdout.replaceAll(single.dir, '<out>'));
      const mine = outputs(run.dir);
      const theirs = outputs(single.dir);
      expect([...mine.keys()]).toEqual([...theirs.keys()]);
      // Both search stars' maps and data are among the files compared.
      expect([...mine.keys()].filter((n) => /^map-.*\.json$/.test(n))).toHaveLength(2);
      for (const [name, bytes] of theirs) expect(mine.get(name)!.equals(bytes), name).toBe(true);
      const parts = readdirSync(run.dir).filter((n) => PART.test(n));
      expect(parts).toHaveLength(count);
      // The 24 blind-search cells (2 stars x 4 x 3), each in one part only, spread evenly.
      const sizes = parts.map((n) => JSON.parse(readFileSync(path.join(run.dir, n), 'utf8')).cells.length);
      expect(sizes.reduce((a, b) => a + b, 0)).toBe(24);
      expect(Math.max(...sizes) - Math.min(...sizes)).toBeLessThanOrEqual(1);
    });
  }

  it('a merge prints the same JSON document as one run', async () => {
    const run = await shardedRun('parts-json', 2, ['--json']);
    expect(JSON.parse(run.stdout.replaceAll(run.dir, '<out>'))).toEqual(JSON.parse(single.json));
  });

  it('refuses parts that do not belong to the run, each with one line and status 2', async () => {
    const { dir, plan } = withPlan('refused');
    const fail = async (args: string[], pattern: RegExp) => {
      const r = await runCliInProcess(['map', '--plan', plan, ...args]);
      expect(r.status).toBe(2);
      expect(r.stderr.trim().split('\n')).toHaveLength(1);
      expect(r.stderr).toMatch(pattern);
    };
    await fail([...small, '--merge'], /--merge = .*map parts written by crest map --shard/);
    await fail([...small, '--shard', '3/3'], /--shard = "3\/3": i\/n: part i of n/);
    await fail([...small, '--shard', '0/2', '--json'], /--json = true: not with --shard/);
    await ok(['map', '--plan', plan, ...small, '--shard', '0/2']);
    await fail([...small, '--merge'], /all 2 parts; missing map-shard-1-of-2\.json/);
    await ok(['map', '--plan', plan, ...small, '--shard', '1/2']);
    // Other flags than the parts had.
    await fail(['--grid', '4x3', '--trials', '31', '--seed', '5', '--merge'], /map-shard-0-of-2\.json: request = .*give --merge the flags the parts had/);
    // A part of another split left in the folder.
    await ok(['map', '--plan', plan, ...small, '--shard', '0/3']);
    await fail([...small, '--merge'], /splits into 2 and 3 parts: remove the old ones/);
    rmSync(path.join(dir, 'map-shard-0-of-3.json'));
    // A damaged part: one input line naming the key.
    const partFile = path.join(dir, 'map-shard-1-of-2.json');
    const good = readFileSync(partFile, 'utf8');
    writeFileSync(partFile, good.replace(/"detection":[0-9.e-]+/, '"detection":1.5'));
    await fail(
      [...small, '--merge'],
      /map-shard-1-of-2\.json: cells\.0\.detection = 1\.5: a fraction from 0 to 1|map-shard-1-of-2\.json: cells\[0\]\.detection = 1\.5/,
    );
    writeFileSync(partFile, good);
    // The plan changed after the parts were made (one byte more).
    writeFileSync(plan, `${readFileSync(plan, 'utf8')}\n`);
    await fail([...small, '--merge'], /planSha256 = .*the part was made from another plan/);
  });
});

import { realpathSync, existsSync } from 'node:fs';
import path from 'node:path';
import { inputError } from '../errors.js';
import { writeAtomic } from './write.js';

/** A folder-friendly form of a campaign name: `SELVA follow-up 2027A` → `selva-follow-up-2027a`. */
export function slug(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'campaign';
}

const real = (p: string) => (existsSync(p) ? realpathSync(p) : path.resolve(p));

/**
 * Writes each named output under `outDir`, atomically. Refuses (input error, nothing written)
 * when an output would replace one of the input files.
 */
export function writeOutputs(outDir: string, files: Record<string, string>, inputs: string[]): string[] {
  const protectedPaths = new Set(inputs.map(real));
  const targets = Object.keys(files).map((name) => path.join(outDir, name));
  for (const file of targets) {
    if (protectedPaths.has(real(file))) {
      throw inputError({ file: 'command line', field: '--out', value: outDir, allowed: `a folder where no input file would be overwritten (${file} is an input)` });
    }
  }
  for (const [name, content] of Object.entries(files)) writeAtomic(path.join(outDir, name), content);
  return targets;
}

import { realpathSync, existsSync } from 'node:fs';
import path from 'node:path';
import { inputError } from '../errors.js';
import { writeAtomic } from './write.js';

/** A folder-friendly form of a campaign name: `SELVA follow-up 2027A` → `selva-follow-up-2027a`. */
export function slug(name: string): string {
  return name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-+|-+$/g, '') || 'campaign';
}

const real = (p: string) => (existsSync(p) ? realpathSync(p) : path.resolve(p));

/** Refuses (input error) when any named output under `outDir` would replace one of the input files. */
export function checkOutputs(outDir: string, names: string[], inputs: string[]): void {
  const protectedPaths = new Set(inputs.map(real));
  for (const file of names.map((name) => path.join(outDir, name))) {
    if (protectedPaths.has(real(file))) {
      throw inputError({ file: 'command line', field: '--out', value: outDir, allowed: `a folder where no input file would be overwritten (${file} is an input)` });
    }
  }
}

/** Writes each named output under `outDir`, atomically, after checkOutputs; returns the paths. */
export function writeOutputs(outDir: string, files: Record<string, string>, inputs: string[]): string[] {
  checkOutputs(outDir, Object.keys(files), inputs);
  return Object.entries(files).map(([name, content]) => {
    const file = path.join(outDir, name);
    writeAtomic(file, content);
    return file;
  });
}

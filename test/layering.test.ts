// Import direction (DEVELOPERS.md, "Layers"): every relative import in src/ goes to the same layer
// or a lower one, and nothing in src/ reaches test/, reference/ or bench/ (they never ship in dist/).
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('..', import.meta.url));
const SRC = path.join(ROOT, 'src');

/**
 * Lowest first. A layer is a folder of src/ or a file at its top; `base` holds the shared
 * vocabulary every layer may use (errors, extent, the input model with the site and constraint schemas, the field schemas).
 * No exceptions are allowed: code that a lower layer needs moves down.
 */
const LAYERS: string[][] = [
  ['errors.ts', 'extent.ts', 'field-schemas.ts', 'model.ts', 'site.ts', 'constraints.ts'],
  ['astro'],
  ['orbit'],
  ['sky'],
  ['rv'],
  ['schedule'],
  ['plan'],
  ['report'],
  ['io'],
  ['cli'],
  ['cli.ts', 'index.ts'],
];

/** Every module a TypeScript file names: `import … from`, `export … from`, `import '…'`, `import('…')`. */
function importsOf(source: string): string[] {
  const patterns = [/^\s*(?:import|export)\s[^;]*?\sfrom\s*['"]([^'"]+)['"]/gm, /^\s*import\s*['"]([^'"]+)['"]/gm, /\bimport\s*\(\s*['"]([^'"]+)['"]\s*\)/g];
  return patterns.flatMap((re) => [...source.matchAll(re)].map((m) => m[1]!));
}

function tsFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? tsFiles(path.join(dir, e.name)) : e.name.endsWith('.ts') ? [path.join(dir, e.name)] : [],
  );
}

/** The layer index of a file under src/. */
function layerOf(file: string): number {
  const top = path.relative(SRC, file).split(path.sep)[0]!;
  const index = LAYERS.findIndex((names) => names.includes(top));
  if (index < 0) throw new Error(`${path.relative(ROOT, file)} is in no layer: add its folder to LAYERS and DEVELOPERS.md`);
  return index;
}

const files = tsFiles(SRC);
const edges = files.flatMap((from) =>
  importsOf(readFileSync(from, 'utf8'))
    .filter((spec) => spec.startsWith('.'))
    .map((spec) => ({ from, to: path.resolve(path.dirname(from), spec).replace(/\.js$/, '.ts') })),
);
const rel = (file: string) => path.relative(ROOT, file);

describe('import direction in src/', () => {
  it('parses every import of a known file (11 in src/io/plan-json.ts, one of them over several lines)', () => {
    // Counted by hand: zod, errors, field-schemas, model, plan-schema (multi-line), constraints,
    // output-set, read-text, site, slug, zod-issue.
    expect(importsOf(readFileSync(path.join(SRC, 'io', 'plan-json.ts'), 'utf8'))).toHaveLength(11);
    // An `export … from` counts too: src/rv/bands.ts imports a type from model.ts and re-exports two names.
    expect(importsOf(readFileSync(path.join(SRC, 'rv', 'bands.ts'), 'utf8'))).toEqual(['../model.js', '../model.js']);
    expect(importsOf("import x from './a.js';\nexport { y } from \"../b.js\";\nimport './c.js';\nconst z = await import('./d.js');")).toEqual([
      './a.js',
      '../b.js',
      './c.js',
      './d.js',
    ]);
  });

  it('finds a few hundred relative imports, each to an existing src/ file', () => {
    expect(edges.length).toBeGreaterThan(300);
    const known = new Set(files);
    expect(edges.filter((e) => e.to.startsWith(SRC + path.sep) && !known.has(e.to)).map((e) => `${rel(e.from)} -> ${rel(e.to)}`)).toEqual([]);
  });

  it('never imports test/, reference/ or bench/ code', () => {
    const outside = edges.filter((e) => !e.to.startsWith(SRC + path.sep));
    expect(outside.map((e) => `${rel(e.from)} -> ${rel(e.to)}`)).toEqual([]);
  });

  it('never imports a higher layer', () => {
    const upward = edges.filter((e) => e.to.startsWith(SRC + path.sep) && layerOf(e.to) > layerOf(e.from)).map((e) => `${rel(e.from)} -> ${rel(e.to)}`);
    expect(upward).toEqual([]);
  });

  it('would see an upward import (the rule itself)', () => {
    expect(layerOf(path.join(SRC, 'sky', 'nights.ts'))).toBeLessThan(layerOf(path.join(SRC, 'rv', 'precision.ts')));
    expect(layerOf(path.join(SRC, 'model.ts'))).toBe(0);
    expect(layerOf(path.join(SRC, 'cli', 'main.ts'))).toBeGreaterThan(layerOf(path.join(SRC, 'io', 'site.ts')));
  });
});

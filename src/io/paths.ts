import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import path from 'node:path';

/** The nearest folder above this module holding package.json: the package root from src/io, dist/io and build/bench/src/io. */
function packageRoot(): string {
  let dir = path.dirname(fileURLToPath(import.meta.url));
  while (!existsSync(path.join(dir, 'package.json')) && path.dirname(dir) !== dir) dir = path.dirname(dir);
  return dir;
}

export const PACKAGE_ROOT = packageRoot();
export const SITES_DIR = path.join(PACKAGE_ROOT, 'sites');
export const INSTRUMENTS_DIR = path.join(SITES_DIR, 'instruments');
export const DEMO_CAMPAIGN = path.join(PACKAGE_ROOT, 'examples', 'demo', 'campaign.yaml');

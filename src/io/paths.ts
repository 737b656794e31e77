import { fileURLToPath } from 'node:url';
import path from 'node:path';

/** The package's root folder, from both src/io and dist/io. */
export const PACKAGE_ROOT = fileURLToPath(new URL('../../', import.meta.url));
export const SITES_DIR = path.join(PACKAGE_ROOT, 'sites');
export const INSTRUMENTS_DIR = path.join(SITES_DIR, 'instruments');
export const DEMO_CAMPAIGN = path.join(PACKAGE_ROOT, 'examples', 'demo', 'campaign.yaml');

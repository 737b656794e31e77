import { fileURLToPath } from 'node:url';

/** Path of a campaign under test/fixtures/campaigns/. */
export function fixture(name: string, file = 'campaign.yaml'): string {
  return fileURLToPath(new URL(`../fixtures/campaigns/${name}/${file}`, import.meta.url));
}

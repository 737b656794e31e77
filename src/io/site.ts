import type { Site } from '../model.js';
import { siteSchema } from '../site.js';
import { readStructured } from './read-text.js';
import { issueToError } from './zod-issue.js';

export function parseSite(data: unknown, file: string): Site {
  const result = siteSchema.safeParse(data);
  if (!result.success) throw issueToError(file, data, result.error);
  const site = result.data;
  return { ...site, horizon: site.horizon?.slice().sort((a, b) => a.azimuthDeg - b.azimuthDeg), file };
}

export function readSite(file: string): Site {
  return parseSite(readStructured(file, 'site file'), file);
}

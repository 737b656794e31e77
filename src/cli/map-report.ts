// The report side of `crest map`: each blind-search map is also saved as map-<target>.json
// (the chart's data), and a report.html in the output folder is re-rendered with every saved map
// of the plan's blind-search targets, so mapping one target keeps the maps made before.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { slug } from '../io/slug.js';
import type { Plan } from '../plan/plan-schema.js';
import type { DetectionMapData } from '../report/html/chart-detection-map.js';
import { renderReportHtml } from '../report/html/report-html.js';

/** File name of a target's saved map data. */
export const mapDataFile = (targetId: string) => `map-${slug(targetId)}.json`;

/** A saved map, if the file exists and holds one for this target (anything else is ignored). */
function savedMap(outDir: string, targetId: string): DetectionMapData | undefined {
  const file = path.join(outDir, mapDataFile(targetId));
  if (!existsSync(file)) return undefined;
  try {
    const data = JSON.parse(readFileSync(file, 'utf8')) as DetectionMapData;
    return data.targetId === targetId && Array.isArray(data.panels) ? data : undefined;
  } catch {
    return undefined;
  }
}

/**
 * report.html with the detection maps of the plan's blind-search targets: the fresh ones, else
 * those saved by an earlier run in `outDir`. Undefined when `outDir` holds no report.html.
 */
export async function reportWithMaps(plan: Plan, outDir: string, fresh: DetectionMapData[]): Promise<string | undefined> {
  if (!existsSync(path.join(outDir, 'report.html'))) return undefined;
  return renderReportHtml(plan, savedMaps(plan, outDir, fresh));
}

/** The maps of the plan's blind-search targets: the fresh ones, else those saved in `dir`. */
export function savedMaps(plan: Plan, dir: string, fresh: DetectionMapData[] = []): Map<string, DetectionMapData> {
  const maps = new Map<string, DetectionMapData>();
  for (const target of plan.campaign.targets.filter((t) => t.search)) {
    const map = fresh.find((m) => m.targetId === target.id) ?? savedMap(dir, target.id);
    if (map) maps.set(target.id, map);
  }
  return maps;
}

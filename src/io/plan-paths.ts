// The files a plan names (campaign, target list, site, instrument, observed visits, and the rows
// that cite them), rewritten relative to the folder the plan is written to, so that plan.json and
// the files beside it stay true when the folder is moved with its inputs or read from another
// working directory. The terminal keeps the paths as the user typed them.
import path from 'node:path';
import type { Plan } from '../plan/plan-schema.js';

/** A path as seen from `outDir` (both relative to the working directory, or absolute). */
const from = (outDir: string) => (file: string) => path.relative(path.resolve(outDir), path.resolve(file)) || '.';

/** `targets.csv row 3 (line 5)` with its file part rewritten, when it starts with `file`. */
function withFile(source: string, file: string, moved: string): string {
  return source.startsWith(`${file} `) ? `${moved}${source.slice(file.length)}` : source;
}

export function planWithPathsFrom(plan: Plan, outDir: string): Plan {
  const move = from(outDir);
  const c = plan.campaign;
  const targetsFile = move(c.targetsFile);
  const observedFile = c.observed && move(c.observed.file);
  const observedSource = (source: string) => (c.observed && observedFile ? withFile(source, c.observed.file, observedFile) : source);
  return {
    ...plan,
    campaign: {
      ...c,
      file: move(c.file),
      targetsFile,
      site: { ...c.site, file: move(c.site.file) },
      instrument: { ...c.instrument, file: move(c.instrument.file) },
      targets: c.targets.map((t) => ({ ...t, source: withFile(t.source, c.targetsFile, targetsFile) })),
      ...(c.observed && observedFile ? { observed: { ...c.observed, file: observedFile } } : {}),
    },
    ...(plan.observed ? { observed: plan.observed.map((o) => ({ ...o, source: observedSource(o.source) })) } : {}),
  };
}

// One `crest plan CAMPAIGN --out DIR` in a process of its own, for the end-to-end bench
// (plan-e2e.ts), so that the peak memory it reports is this run's alone. The stages are the ones a
// user sees on a terminal: stderr is made to look like one, and each stage line is time-stamped
// here instead of drawn. Everything before the first stage ("reading") is reading the campaign,
// its targets, site and instrument and checking the folder. The figures go to the parent over IPC.
import { main } from '../src/cli/main.js';

export interface ChildFigures {
  status: number;
  /** Seconds from the call of main to its return. */
  totalSec: number;
  /** Seconds in each stage, in the order they ran. */
  stageSec: Record<string, number>;
  peakRssMb: number;
  heapLimitMb: number;
  /** What the run wrote on stderr besides its stage lines (an error's one line). */
  stderr: string;
}

const STAGE_LINE = /crest plan: ([a-z ]+) \[/;

const nowSec = () => Number(process.hrtime.bigint()) / 1e9;

async function run(campaignFile: string, outDir: string): Promise<ChildFigures> {
  const marks: { stage: string; atSec: number }[] = [{ stage: 'reading', atSec: nowSec() }];
  let stderr = '';
  const stream = process.stderr;
  Object.defineProperty(stream, 'isTTY', { value: true });
  stream.write = ((chunk: string | Uint8Array) => {
    const text = String(chunk);
    const stage = STAGE_LINE.exec(text)?.[1];
    if (stage && marks.at(-1)!.stage !== stage) marks.push({ stage, atSec: nowSec() });
    else if (!stage && text !== '\r\x1b[K') stderr += text;
    return true;
  }) as typeof stream.write;
  const status = await main(['node', 'crest', 'plan', campaignFile, '--out', outDir]);
  const endSec = nowSec();
  const stageSec: Record<string, number> = {};
  marks.forEach((m, i) => {
    stageSec[m.stage] = Number(((marks[i + 1]?.atSec ?? endSec) - m.atSec).toFixed(2));
  });
  const { heap_size_limit } = (await import('node:v8')).getHeapStatistics();
  return {
    status,
    totalSec: Number((endSec - marks[0]!.atSec).toFixed(2)),
    stageSec,
    peakRssMb: Math.round(process.resourceUsage().maxRSS / 1024),
    heapLimitMb: Math.round(heap_size_limit / 2 ** 20),
    stderr: stderr.trim(),
  };
}

const [campaignFile, outDir] = process.argv.slice(2);
const figures = await run(campaignFile!, outDir!);
process.send?.(figures, () => process.exit(0));

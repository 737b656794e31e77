// The memory guard of `crest plan`: before the candidate visits are built, their
// number is counted from the windows and the memory the run will need for them estimated; a
// campaign that would not fit in the heap stops here with one line naming its size and what to
// reduce, rather than crash the JavaScript heap minutes later with nothing written.
import { inputError } from '../errors.js';
import type { Window } from '../model.js';
import type { Campaign } from './campaign.js';
import { SLOT_STEP_MIN, type StarSetup } from './candidates.js';

/**
 * Heap a run holds at its peak: a fixed part (the program, the site and instrument) and a part per
 * candidate visit (the visit, its details, the optimiser's and the weather trials' share). Measured
 * with `crest plan` on invented campaigns of 180 nights (reference/invented-campaign.ts), December
 * 2026: 2 stars (7,879 visits) held 33 MB after their largest full collection (node --trace-gc);
 * 20 stars (83,256 visits) crashed with --max-old-space-size=80 and completed with 112, so the
 * visits' part lies between 620 and 1,050 bytes each; a 1,000-star campaign (about 3.8 million
 * visits) completed within a 4.1 GB heap, so below 1,090. The guard takes 900.
 */
export const FIXED_HEAP_BYTES = 40e6;
export const HEAP_BYTES_PER_VISIT = 900;

/** The part of the heap limit the run may count on (V8 needs room to collect near its limit). */
export const HEAP_SHARE = 0.9;

/** What `crest plan` may use: the JavaScript heap limit, read at the command line (v8.getHeapStatistics). */
export interface MemoryBudget {
  heapLimitBytes?: number;
}

/**
 * Candidate visits the windows can hold: blocks every SLOT_STEP_MIN from the first whole minute,
 * the whole block inside the window, as candidateSlots makes them (src/plan/candidates.ts), on
 * the nights still open; before blocks across a transit are left out, so an upper bound.
 */
export function candidateVisitCount(windows: Window[], stars: StarSetup[], openDates: Set<string>): number {
  const durationMs = new Map(stars.flatMap((s) => (s.scheduleTarget ? [[s.starId, s.durationSec * 1000] as const] : [])));
  const stepMs = SLOT_STEP_MIN * 60_000;
  let count = 0;
  for (const w of windows) {
    const blockMs = durationMs.get(w.targetId);
    if (blockMs === undefined || !openDates.has(w.localDate)) continue;
    const spanMs = w.end.getTime() - Math.ceil(w.start.getTime() / 60_000) * 60_000 - blockMs;
    if (spanMs >= 0) count += Math.floor(spanMs / stepMs) + 1;
  }
  return count;
}

/** Bytes as GB with one decimal, or MB below 1 GB. */
const size = (bytes: number) => (bytes >= 1e9 ? `${(bytes / 1e9).toFixed(1)} GB` : `${Math.round(bytes / 1e6)} MB`);

/** Refuses a campaign whose run would need more than its share of the heap limit (an InputError, exit 2). */
export function checkVisitBudget(campaign: Campaign, visits: number, stars: number, heapLimitBytes: number): void {
  const needBytes = FIXED_HEAP_BYTES + visits * HEAP_BYTES_PER_VISIT;
  const allowedBytes = heapLimitBytes * HEAP_SHARE;
  if (needBytes <= allowedBytes) return;
  const allowed =
    `${stars} stars, a block every ${SLOT_STEP_MIN} min of their windows: the run would need about ${size(needBytes)}, ` +
    `above the ${size(allowedBytes)} it can count on (heap limit ${size(heapLimitBytes)}); ` +
    'shorten the window, plan fewer candidates or lower maxAirmass, or raise the limit with NODE_OPTIONS=--max-old-space-size=MB';
  throw inputError({ file: campaign.file, field: 'campaign size', value: `${visits} candidate visits`, allowed });
}

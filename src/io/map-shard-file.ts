import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { z } from 'zod';
import { fraction, wholeNonNegative } from '../field-schemas.js';
import { recoverBeforeReading } from './output-set.js';
import { readJson } from './read-text.js';
import { issueToError } from './zod-issue.js';

// One part of a map split across machines (`crest map --shard i/n`): the blind-search cells this
// part computed, with what makes the parts of one run recognisable: the plan file's SHA-256 and
// the map request (target, axes, trials, FAP, seed, eccentricity) as the run wrote it.

/** File name of part `index` (0-based) of `count`. */
export const mapShardFile = (index: number, count: number) => `map-shard-${index}-of-${count}.json`;
/** Matches a part's file name; groups: index, count. */
export const MAP_SHARD_NAME = /^map-shard-(\d+)-of-(\d+)\.json$/;

const cellSchema = z.strictObject({
  targetId: z.string().min(1, 'a target id'),
  cell: wholeNonNegative,
  detection: fraction,
});

const shardSchema = z.strictObject({
  crestMapShard: z.literal(1, 'a Crest map part (written by crest map --shard), version 1'),
  shard: z.strictObject({ index: wholeNonNegative, count: wholeNonNegative.min(1, 'a whole number, 1 or more') }),
  planSha256: z.string().regex(/^[0-9a-f]{64}$/, 'a SHA-256 digest in hex'),
  /** The request as JSON.stringify wrote it: compared as text, never interpreted. */
  request: z.string(),
  cells: z.array(cellSchema),
});

export type MapShard = z.infer<typeof shardSchema>;
export type ShardCell = z.infer<typeof cellSchema>;

/** SHA-256 of a file's bytes, hex: the identity of the plan a part was computed from. */
export function fileSha256(file: string): string {
  return createHash('sha256').update(readFileSync(file)).digest('hex');
}

/** A part's file text: one JSON document, one cell a line. */
export function mapShardText(shard: MapShard): string {
  const { cells, ...head } = shard;
  const headText = JSON.stringify(head).slice(0, -1);
  return `${headText},"cells":[\n${cells.map((c) => JSON.stringify(c)).join(',\n')}\n]}\n`;
}

/** Reads one part; a damaged or foreign file is one input-error line naming its key. */
export function readMapShard(file: string): MapShard {
  recoverBeforeReading(file);
  const data = readJson(file, 'map part');
  const parsed = shardSchema.safeParse(data);
  if (!parsed.success) throw issueToError(file, data, parsed.error);
  return parsed.data;
}

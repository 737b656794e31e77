// CSV in pieces: the pieces joined are the one-piece RFC 4180 text, every piece ends a record.
import { stringify } from 'csv-stringify/sync';
import { describe, expect, it } from 'vitest';
import { csvChunks } from '../../src/report/csv.js';

describe('csvChunks', () => {
  it('25,001 rows with quotes, commas and line breaks: pieces of whole records, joined equal to one stringify call', () => {
    const rows = Array.from({ length: 25_001 }, (_, i) => [`t${i}`, i % 7 === 0 ? 'a, "quoted"\nvalue' : String(i / 3), i]);
    const pieces = [...csvChunks(['id', 'text', 'n'], rows)];
    expect(pieces.length).toBe(1 + 3);
    for (const piece of pieces) expect(piece.endsWith('\r\n')).toBe(true);
    expect(pieces.join('')).toBe(stringify([['id', 'text', 'n'], ...rows], { record_delimiter: 'windows' }));
  });
});

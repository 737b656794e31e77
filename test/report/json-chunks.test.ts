import { describe, expect, it } from 'vitest';
import { jsonChunks } from '../../src/report/json-chunks.js';

describe('jsonChunks', () => {
  const value = {
    name: 'Invented',
    when: new Date('2027-03-01T01:02:03Z'),
    skipped: undefined,
    fn: () => 1,
    empty: [],
    none: {},
    targets: Array.from({ length: 300 }, (_, i) => ({
      id: `Star-${i}`,
      k: i / 7,
      tags: ['a', i],
      nested: { deep: { deeper: [i, null, undefined] } },
      gone: undefined,
    })),
    list: [undefined, 1, 'two', null, { a: [] }],
  };

  it('joins to exactly the text of JSON.stringify(value, null, 2)', () => {
    expect([...jsonChunks(value)].join('')).toBe(JSON.stringify(value, null, 2));
    expect([...jsonChunks([])].join('')).toBe('[]');
    expect([...jsonChunks('text')].join('')).toBe('"text"');
  });

  it('hands the text over in pieces of about the asked size', () => {
    const pieces = [...jsonChunks(value, 1000)];
    expect(pieces.length).toBeGreaterThan(20);
    expect(Math.max(...pieces.map((p) => p.length))).toBeLessThan(2000);
  });
});

describe('jsonChunks and numbers that are not finite', () => {
  it.each([NaN, Infinity, -Infinity])('refuses %s rather than write null', (bad) => {
    expect(() => [...jsonChunks({ targets: [{ id: 'Star-1', kMps: bad }] })].join('')).toThrow(/kMps is/);
  });
});

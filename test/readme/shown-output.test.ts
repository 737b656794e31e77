// The README output matcher: `...` stands for left-out lines; anything else must be there, in order.
import { describe, expect, it } from 'vitest';
import { consoleCommands } from './readme-walkthrough.js';
import { shownMismatch } from './shown-output.js';

const OUTPUT = 'title\na\nb\nc\nd\nend\n';

describe('shownMismatch', () => {
  it('accepts the whole output, and output trimmed at the start, middle or end', () => {
    expect(shownMismatch(OUTPUT, ['title', 'a', 'b', 'c', 'd', 'end'])).toBeNull();
    expect(shownMismatch(OUTPUT, ['title', '...', 'c', '...', 'end'])).toBeNull();
    expect(shownMismatch(OUTPUT, ['...', 'd', 'end'])).toBeNull();
    expect(shownMismatch(OUTPUT, ['title', 'a', '...'])).toBeNull();
    expect(shownMismatch('title  \n', ['title'])).toBeNull();
    expect(shownMismatch('', [])).toBeNull();
  });

  it('refuses a changed line, lines out of order, a missing gap and an unshown ending', () => {
    expect(shownMismatch(OUTPUT, ['title', 'a', 'B', 'c', 'd', 'end'])).toBe('line 3: shown "B", printed "b"');
    expect(shownMismatch(OUTPUT, ['title', '...', 'c', 'b', '...'])).toBe('not printed after line 1: ["c","b"]');
    expect(shownMismatch(OUTPUT, ['title', 'b', '...'])).toBe('line 2: shown "b", printed "a"');
    expect(shownMismatch(OUTPUT, ['title', 'a'])).toBe('printed 6 lines where the README shows 2');
    expect(shownMismatch(OUTPUT, ['...', 'd'])).toBe('line 6: shown "d", printed "end"');
    expect(shownMismatch(OUTPUT, ['title', '...', 'a', 'b', 'c', 'd', 'end', 'after'])).toBe('line 1: shown "a", printed "title"');
    expect(shownMismatch(OUTPUT, [])).toBe('printed 6 lines where the README shows 0');
  });
});

describe('consoleCommands', () => {
  it('gives each "$ " line the lines under it', () => {
    expect(consoleCommands(['$ one', 'x', '', '$ two', '$ three', 'y'])).toEqual([
      { command: 'one', shown: ['x', ''] },
      { command: 'two', shown: [] },
      { command: 'three', shown: ['y'] },
    ]);
    expect(() => consoleCommands(['stray', '$ one'])).toThrow('output before any "$ " command: stray');
  });
});

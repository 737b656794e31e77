// Seeded fuzzing of the observed-visits file, read in-process (no command reads it yet): a
// mutated file either parses into rows that keep the file's rules or is refused with one
// InputError line that starts with the file's name. Anything else (another error, a message
// over one line, a row outside the rules) is a fault.
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { parseObserved } from '../../src/io/observed.js';
import { createRng } from '../../src/rv/random.js';
import { OBSERVED_CSV } from './bases.js';
import { mutateText } from './mutate.js';

const KNOWN = new Set(['Orvel-2', 'Sanu', 'Tekla b']);
const CASES = 3000;

function fault(text: string): string | undefined {
  try {
    for (const row of parseObserved(text, 'observed.csv', KNOWN)) {
      const times = Number(row.midBjdTdb !== undefined) + Number(row.midUtc !== undefined);
      if (times !== 1 || !KNOWN.has(row.targetId) || (row.rvMps === undefined) !== (row.rvErrorMps === undefined))
        return `row outside the rules: ${JSON.stringify(row)}`;
      if (row.midBjdTdb !== undefined && !(row.midBjdTdb >= 2.4e6 && row.midBjdTdb <= 2.6e6)) return `BJD out of range: ${row.midBjdTdb}`;
    }
    return undefined;
  } catch (err) {
    if (!(err instanceof InputError)) return `not an InputError: ${String(err)}`;
    if (/\n/.test(err.message) || !err.message.startsWith('observed.csv: ')) return `bad message: ${err.message}`;
    return undefined;
  }
}

describe('fuzz: mutated observed-visits files', () => {
  it(`${CASES} seeded cases end in rows within the rules or one located InputError line`, () => {
    const rng = createRng(1790);
    const failures: string[] = [];
    for (let i = 0; i < CASES && failures.length < 3; i++) {
      let text = OBSERVED_CSV;
      const edits = 1 + Math.floor(rng.uniform() * 3);
      for (let k = 0; k < edits; k++) text = mutateText(text, rng);
      const found = fault(text);
      if (found) failures.push(`${found}\n${JSON.stringify(text)}`);
    }
    expect(failures).toEqual([]);
  });

  it('the base file itself parses', () => {
    expect(parseObserved(OBSERVED_CSV, 'observed.csv', KNOWN)).toHaveLength(3);
  });
});

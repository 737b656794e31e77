import { describe, expect, it } from 'vitest';
import { jsonErrorOffset } from '../../src/io/json-syntax.js';
import { createRng } from '../../src/rv/random.js';
import { PLAN_JSON } from '../fuzz/bases.js';
import { mutateText } from '../fuzz/mutate.js';

const parses = (text: string) => {
  try {
    JSON.parse(text);
    return true;
  } catch {
    return false;
  }
};

describe('jsonErrorOffset', () => {
  it.each([
    ['{"a":}', 5],
    ['{"a":1', 6],
    ['[1,]', 3],
    ['{"a":1}x', 7],
    ['"\\u12"', 1],
    ['{"a":"x\ny"}', 7],
    ['01', 1],
    ['', 0],
  ])('%j breaks at offset %i', (text, offset) => {
    expect(jsonErrorOffset(text)).toBe(offset);
  });

  it('agrees with JSON.parse on 3,000 seeded edits of a plan.json', () => {
    const rng = createRng(41);
    const disagreements: string[] = [];
    for (let i = 0; i < 3000; i++) {
      const text = mutateText(`${PLAN_JSON.slice(0, 1500 + Math.floor(rng.uniform() * 400))}]}`, rng);
      if ((jsonErrorOffset(text) === undefined) !== parses(text)) disagreements.push(text.slice(0, 80));
      const whole = mutateText(PLAN_JSON, rng);
      if ((jsonErrorOffset(whole) === undefined) !== parses(whole)) disagreements.push(whole.slice(0, 80));
    }
    expect(disagreements).toEqual([]);
  });
});

// Seeded mutations of text, of parsed JSON and of command lines. Each mutation is a small edit
// of the kind a person or a broken tool makes: a cut, a doubled line, a stray quote, a number
// replaced by an awkward one.
import type { Rng } from '../../src/rv/random.js';

/** Awkward numbers and words: the edges of doubles, other bases, and number look-alikes. */
export const AWKWARD = [
  '0',
  '-0',
  '-1',
  '1e309',
  '-1e309',
  '5e-324',
  '1e-209',
  '1e300',
  'NaN',
  'Infinity',
  '-Infinity',
  '0x10',
  '0b11',
  '1_000',
  '9007199254740993',
  '9999',
  '0001',
  '2.4e6',
  '2461000.5',
  '99999',
  '10000',
  '',
  ' ',
  '1,5',
  '١٢',
  '1e',
  '.',
  '+',
  '--1',
  'null',
  'true',
];
/** Stray characters: delimiters, quotes and YAML indicators. */
const STRAY = ['"', "'", ',', '#', '\n', '\r', '\t', '[', ']', '{', '}', ':', '&a', '*a', '!tag ', '|', '>', '%', '@', '\u0000', '\u00e9', '\ufeff', '\\'];

const pick = <T>(rng: Rng, list: readonly T[]): T => list[Math.floor(rng.uniform() * list.length)]!;
const at = (rng: Rng, n: number) => Math.floor(rng.uniform() * (n + 1));

/** One seeded edit of a text. */
export function mutateText(text: string, rng: Rng): string {
  const lines = text.split('\n');
  const i = Math.floor(rng.uniform() * lines.length);
  const numbers = [...text.matchAll(/-?\d+(\.\d+)?(e-?\d+)?/g)];
  switch (Math.floor(rng.uniform() * 9)) {
    case 0: {
      const a = at(rng, text.length);
      return text.slice(0, a) + text.slice(a + 1 + Math.floor(rng.uniform() * 8));
    }
    case 1: {
      const a = at(rng, text.length);
      return text.slice(0, a) + pick(rng, STRAY) + text.slice(a);
    }
    case 2:
      return [...lines.slice(0, i + 1), lines[i]!, ...lines.slice(i + 1)].join('\n');
    case 3:
      return [...lines.slice(0, i), ...lines.slice(i + 1)].join('\n');
    case 4:
      return text.slice(0, at(rng, text.length));
    case 5:
    case 6: {
      if (!numbers.length) return text + pick(rng, AWKWARD);
      const m = pick(rng, numbers);
      return text.slice(0, m.index) + pick(rng, AWKWARD) + text.slice(m.index! + m[0].length);
    }
    case 7: {
      const j = Math.floor(rng.uniform() * lines.length);
      [lines[i], lines[j]] = [lines[j]!, lines[i]!];
      return lines.join('\n');
    }
    default:
      return lines.map((line) => (rng.uniform() < 0.2 ? `#${line}` : line)).join('\n');
  }
}

/** Every key path of a parsed JSON value, up to `limit` of them. */
function keyPaths(value: unknown, limit = 4000): (string | number)[][] {
  const out: (string | number)[][] = [];
  const walk = (node: unknown, trail: (string | number)[]) => {
    if (out.length >= limit || node === null || typeof node !== 'object') return;
    for (const [k, v] of Object.entries(node)) {
      const key = Array.isArray(node) ? Number(k) : k;
      out.push([...trail, key]);
      walk(v, [...trail, key]);
    }
  };
  walk(value, []);
  return out;
}

const REPLACEMENTS: unknown[] = [null, 0, -1, 1e308, -1e308, 5e-324, 1e-209, 2.5, '', 'x', '2027-13-45', [], {}, [1, 2], true, 'NaN', 1e6, 2461000.5];

/** One seeded edit of a JSON document: a key removed, a value replaced, an array entry doubled. */
export function mutateJson(text: string, rng: Rng): string {
  const data = JSON.parse(text) as unknown;
  const paths = keyPaths(data);
  const path = pick(rng, paths);
  const parent = path.slice(0, -1).reduce<unknown>((node, key) => (node as Record<string | number, unknown>)[key], data) as Record<string | number, unknown> &
    unknown[];
  const key = path[path.length - 1]!;
  const r = rng.uniform();
  if (r < 0.3) {
    if (Array.isArray(parent)) parent.splice(key as number, 1);
    else delete parent[key];
  } else if (r < 0.8) parent[key] = pick(rng, REPLACEMENTS);
  else if (Array.isArray(parent)) parent.push(JSON.parse(JSON.stringify(parent[key as number])));
  else parent[`${String(key)}X`] = parent[key];
  return JSON.stringify(data, null, rng.uniform() < 0.5 ? 2 : 0);
}

/** One seeded edit of a command line: a value replaced, an argument dropped or doubled, a stray flag. */
export function mutateArgs(args: string[], rng: Rng): string[] {
  const out = [...args];
  const i = 1 + Math.floor(rng.uniform() * (out.length - 1));
  const r = rng.uniform();
  if (r < 0.5) out[i] = pick(rng, AWKWARD);
  else if (r < 0.65) out.splice(i, 1);
  else if (r < 0.8) out.splice(i, 0, out[i]!);
  else if (r < 0.9) out.splice(i, 0, pick(rng, ['--json', '--csv', '--utc', '--nope', '-x', '--', '--out']));
  else out[i] = `${out[i]}${pick(rng, STRAY)}`;
  return out;
}

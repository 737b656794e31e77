// JSON.stringify(value, null, 2) in pieces: one string of a very large document (a few hundred
// thousand targets) exceeds the longest string V8 can hold, while its pieces do not.

const INDENT = '  ';

/** Arrays and plain objects are walked; anything else is one JSON.stringify call. */
const walked = (value: unknown): value is object =>
  Array.isArray(value) || (value !== null && typeof value === 'object' && Object.getPrototypeOf(value) === Object.prototype);

/** Values JSON.stringify leaves out of an object (and writes as null in an array). */
const omitted = (value: unknown) => value === undefined || typeof value === 'function' || typeof value === 'symbol';

/**
 * The text of JSON.stringify(value, null, 2), in pieces of about `pieceChars` characters, no
 * piece longer than the longest leaf. Throws on a number that is not finite (NaN, ±Infinity). Walks the top `depth` levels; deeper values are whole leaves.
 */
export function* jsonChunks(value: unknown, pieceChars = 1 << 16, depth = 3): Generator<string> {
  let buffer = '';
  for (const part of parts(value, '', depth, '')) {
    buffer += part;
    if (buffer.length >= pieceChars) {
      yield buffer;
      buffer = '';
    }
  }
  if (buffer) yield buffer;
}

/** JSON would write NaN and ±Infinity as null, silently: a number that is not finite is a fault. */
const finiteOnly = (where: string) =>
  function check(key: string, value: unknown): unknown {
    if (typeof value === 'number' && !Number.isFinite(value)) throw new Error(`JSON output: ${key || where || 'a value'} is ${value}`);
    return value;
  };

function* parts(value: unknown, pad: string, depth: number, where: string): Generator<string> {
  if (depth === 0 || !walked(value)) {
    yield (JSON.stringify(value, finiteOnly(where), 2) ?? 'null').replace(/\n/g, `\n${pad}`);
    return;
  }
  const inner = pad + INDENT;
  const entries = Array.isArray(value)
    ? value.map((v) => [undefined, omitted(v) ? null : v] as const)
    : Object.entries(value)
        .filter(([, v]) => !omitted(v))
        .map(([k, v]) => [k, v] as const);
  const [open, close] = Array.isArray(value) ? ['[', ']'] : ['{', '}'];
  if (entries.length === 0) {
    yield `${open}${close}`;
    return;
  }
  yield open;
  for (let i = 0; i < entries.length; i++) {
    const [key, v] = entries[i]!;
    yield `${i ? ',' : ''}\n${inner}${key === undefined ? '' : `${JSON.stringify(key)}: `}`;
    yield* parts(v, inner, depth - 1, key ?? where);
  }
  yield `\n${pad}${close}`;
}

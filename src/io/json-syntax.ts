// Where a JSON text first breaks the grammar (RFC 8259). JSON.parse says so only for some
// errors; this scanner gives the offset for all of them, without recursion.

const NUMBER = /-?(?:0|[1-9]\d*)(?:\.\d+)?(?:[eE][+-]?\d+)?/y;
const LITERAL = /true|false|null/y;
const ESCAPE = /\\(?:["\\/bfnrt]|u[0-9a-fA-F]{4})/y;

type Expecting = 'value' | 'key' | 'colon' | 'comma-or-close' | 'end';

/** The offset of the first character that makes `text` invalid JSON (its length for a cut-off text); undefined if valid. */
export function jsonErrorOffset(text: string): number | undefined {
  const open: string[] = [];
  let expecting: Expecting = 'value';
  let i = 0;
  const afterValue = (): Expecting => (open.length ? 'comma-or-close' : 'end');
  while (true) {
    while (i < text.length && ' \t\n\r'.includes(text[i]!)) i++;
    if (i >= text.length) return expecting === 'end' ? undefined : text.length;
    const c = text[i]!;
    if (expecting === 'end') return i;
    if (expecting === 'colon') {
      if (c !== ':') return i;
      i++;
      expecting = 'value';
    } else if (expecting === 'comma-or-close') {
      const top = open[open.length - 1];
      if (c === ',') expecting = top === '{' ? 'key' : 'value';
      else if (c === (top === '{' ? '}' : ']')) {
        open.pop();
        expecting = afterValue();
      } else return i;
      i++;
    } else if (c === '"') {
      const end = stringEnd(text, i);
      if (end < 0) return -end - 1;
      i = end;
      expecting = expecting === 'key' ? 'colon' : afterValue();
    } else if (expecting === 'key') {
      if (c !== '}' || text[lastNonSpace(text, i)] !== '{') return i;
      open.pop();
      i++;
      expecting = afterValue();
    } else if (c === '[' || c === '{') {
      open.push(c);
      i++;
      expecting = c === '{' ? 'key' : 'value';
    } else if (c === ']' && open[open.length - 1] === '[' && text[lastNonSpace(text, i)] === '[') {
      open.pop();
      i++;
      expecting = afterValue();
    } else {
      const end = matchAt(NUMBER, text, i) ?? matchAt(LITERAL, text, i);
      if (end === undefined) return i;
      i = end;
      expecting = afterValue();
    }
  }
}

/** Offset just past the closing quote, or −(offset of the fault) − 1. */
function stringEnd(text: string, open: number): number {
  for (let i = open + 1; i < text.length; i++) {
    const c = text[i]!;
    if (c === '"') return i + 1;
    if (c < ' ') return -i - 1;
    if (c === '\\') {
      const end = matchAt(ESCAPE, text, i);
      if (end === undefined) return -i - 1;
      i = end - 1;
    }
  }
  return -text.length - 1;
}

function matchAt(pattern: RegExp, text: string, at: number): number | undefined {
  pattern.lastIndex = at;
  return pattern.test(text) ? pattern.lastIndex : undefined;
}

function lastNonSpace(text: string, before: number): number {
  let i = before - 1;
  while (i >= 0 && ' \t\n\r'.includes(text[i]!)) i--;
  return i;
}

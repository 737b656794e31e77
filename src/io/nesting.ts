// Deep nesting is refused before a parser sees it: recursive parsers and validators overflow
// the call stack long before memory runs out, and no Crest file nests more than a few levels.

/** Deepest bracket nesting a Crest input may have. */
export const MAX_NESTING = 100;

/**
 * The offset of the first `[` or `{` that opens level MAX_NESTING + 1 of flow (JSON-style)
 * nesting, or undefined. Brackets inside quoted strings and `#` comments do not count; block
 * YAML nests by indentation and is bounded by its line length instead.
 */
export function tooDeepAt(text: string, comments: boolean): number | undefined {
  let depth = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (c === '"' || (comments && c === "'")) i = closingQuote(text, i);
    else if (comments && c === '#' && (i === 0 || /\s/.test(text[i - 1]!))) i = lineEnd(text, i);
    else if (c === '[' || c === '{') {
      if (++depth > MAX_NESTING) return i;
    } else if ((c === ']' || c === '}') && depth > 0) depth--;
  }
  return undefined;
}

function closingQuote(text: string, open: number): number {
  const quote = text[open];
  for (let i = open + 1; i < text.length; i++) {
    if (quote === '"' && text[i] === '\\') i++;
    else if (text[i] === quote) return i;
  }
  return text.length;
}

function lineEnd(text: string, from: number): number {
  const end = text.indexOf('\n', from);
  return end < 0 ? text.length : end;
}

/** Line and column (both from 1) of an offset. */
export function lineColumn(text: string, offset: number): { line: number; col: number } {
  let line = 1;
  let start = 0;
  for (let i = text.indexOf('\n'); i >= 0 && i < offset; i = text.indexOf('\n', i + 1)) {
    line++;
    start = i + 1;
  }
  return { line, col: offset - start + 1 };
}

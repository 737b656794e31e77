// Does a command's output match what the README shows under it? The shown lines are the output
// with runs of lines left out where a line reads `...`; trailing spaces are not compared.

const GAP = '...';

/** Null when `actual` (a command's stdout) matches `shown`, else what differs first. */
export function shownMismatch(actual: string, shown: string[]): string | null {
  const out =
    actual === ''
      ? []
      : actual
          .replace(/\n$/, '')
          .split('\n')
          .map((l) => l.trimEnd());
  const chunks = splitAtGaps(shown.map((l) => l.trimEnd()));
  let at = 0;
  for (const [k, chunk] of chunks.entries()) {
    // Without a gap before the first chunk it starts the output; without one after the last, it ends it.
    const fixedStart = k === 0 && shown[0] !== GAP ? at : undefined;
    const fixedEnd = k === chunks.length - 1 && shown[shown.length - 1] !== GAP ? out.length - chunk.length : undefined;
    if (fixedStart !== undefined && fixedEnd !== undefined && fixedStart !== fixedEnd) {
      return `printed ${out.length} lines where the README shows ${chunk.length}`;
    }
    const fixed = fixedStart ?? fixedEnd;
    if (fixed !== undefined) {
      const differs = fixed < at ? 0 : chunk.findIndex((line, j) => out[fixed + j] !== line);
      if (differs >= 0) return `line ${fixed + differs + 1}: shown ${JSON.stringify(chunk[differs])}, printed ${JSON.stringify(out[fixed + differs])}`;
      at = fixed + chunk.length;
    } else {
      const start = firstPlace(out, chunk, at);
      if (start < 0) return `not printed after line ${at}: ${JSON.stringify(chunk)}`;
      at = start + chunk.length;
    }
  }
  return null;
}

/** The shown lines between gaps: `['a', '...', 'b']` gives `[['a'], ['b']]`, and a gap at either end an empty chunk there. */
function splitAtGaps(lines: string[]): string[][] {
  const chunks: string[][] = [[]];
  for (const line of lines) {
    if (line === GAP) chunks.push([]);
    else chunks[chunks.length - 1]!.push(line);
  }
  return chunks;
}

/** The first index at or after `from` where `chunk` is `out`'s next lines, or -1. */
function firstPlace(out: string[], chunk: string[], from: number): number {
  for (let s = from; s + chunk.length <= out.length; s++) if (chunk.every((line, j) => out[s + j] === line)) return s;
  return -1;
}

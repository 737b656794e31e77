// The parser's own complaints (unknown option, missing value, unknown command, too many arguments)
// in Crest's one shape for a bad command line, `crest: command line: <place>: <what is wrong>`,
// the same as the values our flag parsers refuse (`crest: command line: --flag = "value": ...`).

/** `error: unknown option '--star-mas'\n(Did you mean --star-mass?)` → `--star-mas: unknown option (did you mean --star-mass?)`. */
export function commandLineMessage(parserMessage: string): string {
  const [first = '', ...rest] = parserMessage
    .replace(/^error:\s*/i, '')
    .split('\n')
    .map((line) => line.trim())
    .filter((line) => line.length > 0);
  const hint = rest.map((line) => line.replace(/^\((.*)\)$/, '$1').replace(/^Did you mean/, 'did you mean')).join(' ');
  const tail = hint ? ` (${hint})` : '';
  const excess = /^too many arguments(?: for '([^']+)')?\. Expected (\d+) arguments? but got (\d+)\.?$/.exec(first);
  if (excess) return `${excess[1] ?? 'crest'}: too many arguments (at most ${excess[2]}, got ${excess[3]})${tail}`;
  const quoted = /'([^']+)'/.exec(first);
  if (!quoted) return `${first}${tail}`;
  // '--at <time>' names the option --at.
  const place = quoted[1]!.split(' ')[0]!;
  const what = first.replace(quoted[0], '').replace(/\s+/g, ' ').trim();
  return `${place}: ${what}${tail}`;
}

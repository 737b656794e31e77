import { readFileSync } from 'node:fs';
import { LineCounter, parse as parseYaml, YAMLParseError } from 'yaml';
import { InputError, inputError } from '../errors.js';

/** Reads a whole text file, turning a missing or unreadable file into an input error. */
export function readText(file: string, what: string): string {
  try {
    return readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a folder' : `cannot be read (${code})`;
    throw new InputError(`${file}: ${what} ${reason}`);
  }
}

/** Parses JSON or YAML (YAML is a superset of JSON), with the line of a syntax error. */
export function readStructured(file: string, what: string): unknown {
  const text = readText(file, what);
  if (text.trim() === '') {
    throw inputError({ file, field: '(file)', value: '', allowed: `empty file; expected a ${what}` });
  }
  const lineCounter = new LineCounter();
  try {
    return parseYaml(text, { prettyErrors: false, lineCounter });
  } catch (err) {
    if (err instanceof YAMLParseError) {
      // Without prettyErrors the error carries only an offset; the line counter turns it into line and column.
      const line = lineCounter.linePos(err.pos[0]);
      const where = line.line > 0 ? `line ${line.line}, column ${line.col}` : 'syntax';
      const firstLine = err.message.split('\n')[0];
      throw new InputError(`${file}: ${where}: malformed ${/\.json$/i.test(file) ? 'JSON' : 'YAML'}: ${firstLine}`);
    }
    throw err;
  }
}

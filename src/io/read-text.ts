import { readFileSync } from 'node:fs';
import { LineCounter, parseDocument, visit, type Document } from 'yaml';
import { InputError, inputError } from '../errors.js';
import { jsonErrorOffset } from './json-syntax.js';
import { lineColumn, MAX_NESTING, tooDeepAt } from './nesting.js';

/** Most aliases a YAML file may expand: more is refused (an alias bomb grows exponentially). */
const MAX_ALIASES = 100;

/** Reads a whole text file, turning a missing or unreadable file into an input error. */
export function readText(file: string, what: string): string {
  if (file.trim() === '') throw inputError({ file: 'command line', field: what, value: file, allowed: 'a file name' });
  try {
    return readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a folder' : `cannot be read (${code ?? (err as Error).message})`;
    throw new InputError(`${file}: ${what} ${reason}`);
  }
}

/** The one line for a syntax fault at `offset` of a file. */
function syntaxError(file: string, text: string, offset: number, kind: string, message: string): InputError {
  const { line, col } = lineColumn(text, offset);
  return new InputError(`${file}: line ${line}, column ${col}: malformed ${kind}: ${message}`);
}

function checkText(file: string, what: string, text: string, kind: 'JSON' | 'YAML'): void {
  if (text.trim() === '') throw inputError({ file, field: '(file)', value: '', allowed: `empty file; expected a ${what}` });
  const deep = tooDeepAt(text, kind === 'YAML');
  if (deep !== undefined) throw syntaxError(file, text, deep, kind, `nested more than ${MAX_NESTING} levels deep`);
}

/**
 * Parses JSON or YAML (YAML is a superset of JSON). Every fault is an input error with its
 * line and column: syntax, duplicate keys, unknown tags or directives (YAML warnings), and what
 * checkNodes refuses.
 */
export function readStructured(file: string, what: string): unknown {
  const text = readText(file, what);
  const kind = /\.json$/i.test(file) ? 'JSON' : 'YAML';
  checkText(file, what, text, kind);
  const doc = parseDocument(text, { prettyErrors: false, lineCounter: new LineCounter(), logLevel: 'silent', uniqueKeys: true });
  const fault = doc.errors[0] ?? doc.warnings[0];
  if (fault) throw syntaxError(file, text, fault.pos[0], kind, fault.message.split('\n')[0]!);
  const firstAlias = checkNodes(file, text, doc, kind);
  try {
    return doc.toJS({ maxAliasCount: MAX_ALIASES });
  } catch (err) {
    // The only fault left once the aliases are checked: nested aliases that expand too far.
    throw syntaxError(file, text, firstAlias ?? 0, kind, `aliases expand to more than ${MAX_ALIASES} copies (${(err as Error).message.split('\n')[0]})`);
  }
}

/**
 * Refuses what YAML allows but a Crest file never means: an alias without its anchor, more than
 * MAX_ALIASES aliases, numbers written in hexadecimal or octal, and numbers beyond a double
 * (`.inf`, `1e400`). Returns the offset of the first alias.
 */
function checkNodes(file: string, text: string, doc: Document, kind: string): number | undefined {
  let count = 0;
  let first: number | undefined;
  let fault: { offset: number; message: string } | undefined;
  visit(doc, {
    Alias(_key, node) {
      const offset = node.range?.[0] ?? 0;
      first ??= offset;
      if (node.resolve(doc) === undefined) fault = { offset, message: `alias *${node.source} has no anchor &${node.source} before it` };
      else if (++count > MAX_ALIASES) fault = { offset, message: `more than ${MAX_ALIASES} aliases` };
      return fault ? visit.BREAK : undefined;
    },
    Scalar(_key, node) {
      const offset = node.range?.[0] ?? 0;
      const source = text.slice(offset, node.range?.[1] ?? offset);
      if (node.format === 'HEX' || node.format === 'OCT') fault = { offset, message: `${source} is not a decimal number` };
      else if (typeof node.value === 'number' && !Number.isFinite(node.value)) fault = { offset, message: `${source} is not a finite number` };
      return fault ? visit.BREAK : undefined;
    },
  });
  if (fault) throw syntaxError(file, text, fault.offset, kind, fault.message);
  return first;
}

/** Parses a JSON file; a syntax fault is one input-error line with its line and column. */
export function readJson(file: string, what: string): unknown {
  const text = readText(file, what);
  checkText(file, what, text, 'JSON');
  try {
    return JSON.parse(text);
  } catch {
    const offset = jsonErrorOffset(text) ?? 0;
    const message = offset >= text.length ? 'the text ends too early' : `unexpected ${JSON.stringify(text[offset])}`;
    throw syntaxError(file, text, offset, 'JSON', `${message}; expected a ${what}`);
  }
}

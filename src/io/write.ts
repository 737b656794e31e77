import { mkdirSync, renameSync, writeFileSync, rmSync } from 'node:fs';
import path from 'node:path';

/** Writes a file atomically: a temporary file in the same folder, then a rename. */
export function writeAtomic(file: string, content: string | Uint8Array): void {
  mkdirSync(path.dirname(file), { recursive: true });
  const temporary = path.join(path.dirname(file), `.${path.basename(file)}.${process.pid}.tmp`);
  try {
    writeFileSync(temporary, content);
    renameSync(temporary, file);
  } catch (err) {
    rmSync(temporary, { force: true });
    throw err;
  }
}

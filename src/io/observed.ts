// PLACEHOLDER until the observed-file reader lands from its branch.
import type { ObservedRow } from '../model.js';
export function readObserved(file: string, knownIds: ReadonlySet<string>): ObservedRow[] {
  void file;
  void knownIds;
  return [];
}

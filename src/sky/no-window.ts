// The target-nights without a window, grouped by target and reason: one entry per (target,
// reason) with the nights it holds, so a long campaign's list does not repeat the same reason for
// every night (`crest visibility` prints and writes this form).
import type { DropCause, DroppedWindow } from './visibility.js';

export interface NoWindowGroup {
  targetId: string;
  cause: DropCause;
  reason: string;
  /** The local evening dates, in the order computed (night by night). */
  localDates: string[];
}

export function groupNoWindow(dropped: DroppedWindow[]): NoWindowGroup[] {
  const groups = new Map<string, NoWindowGroup>();
  for (const d of dropped) {
    const key = `${d.targetId}\u0000${d.reason}`;
    const group = groups.get(key);
    if (group) group.localDates.push(d.localDate);
    else groups.set(key, { targetId: d.targetId, cause: d.cause, reason: d.reason, localDates: [d.localDate] });
  }
  return [...groups.values()];
}

import type { Plan, PlannedVisit } from '../plan/plan-schema.js';

/**
 * Calendar UIDs (RFC 5545 3.8.4.7) that stay the same across re-plans: `<star>-<localDate>-<k>@crest`,
 * k being the visit's place (1, 2, ...) in start order among that star's visits of that night. A
 * visit moved within its night keeps its UID, so a calendar app updates the event instead of
 * adding a second one. Returns one UID per visit, in the order given.
 */
export function visitUids(visits: readonly PlannedVisit[]): string[] {
  const order = visits.map((_, i) => i).sort((a, b) => Date.parse(visits[a]!.startUtc) - Date.parse(visits[b]!.startUtc) || a - b);
  const counts = new Map<string, number>();
  const uids: string[] = [];
  for (const i of order) {
    const night = `${visits[i]!.starId}-${visits[i]!.localDate}`;
    const k = (counts.get(night) ?? 0) + 1;
    counts.set(night, k);
    uids[i] = `${night}-${k}@crest`;
  }
  return uids;
}

/** A previous plan counts only when it is of the same campaign (same name); otherwise it is ignored. */
export function sameCampaign(plan: Plan, previous: Plan | undefined): Plan | undefined {
  return previous?.campaign.name === plan.campaign.name ? previous : undefined;
}

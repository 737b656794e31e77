import type { Plan } from '../plan/plan-schema.js';
import { sameCampaign, visitUids } from './ics-uid.js';

/**
 * Each visit's calendar SEQUENCE (RFC 5545 3.8.7.4) against the previous plan of the campaign:
 * a visit whose UID was in the previous plan keeps that visit's sequence when its start and
 * length are unchanged and gets one more when they changed; a new UID starts at 0. The sequence
 * is stored in plan.json (`icsSequence`, absent when 0), so the next re-plan continues from it.
 */
export function withIcsSequences(plan: Plan, previous: Plan | undefined): Plan {
  const before = sameCampaign(plan, previous);
  if (!before) return plan;
  const old = new Map(visitUids(before.visits).map((uid, i) => [uid, before.visits[i]!]));
  const uids = visitUids(plan.visits);
  const visits = plan.visits.map((visit, i) => {
    const { icsSequence: _, ...rest } = visit;
    const was = old.get(uids[i]!);
    if (!was) return rest;
    const moved = Date.parse(was.startUtc) !== Date.parse(visit.startUtc) || was.durationSec !== visit.durationSec;
    const sequence = (was.icsSequence ?? 0) + (moved ? 1 : 0);
    return sequence === 0 ? rest : { ...rest, icsSequence: sequence };
  });
  return { ...plan, visits };
}

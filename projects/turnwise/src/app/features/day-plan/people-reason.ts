import type { DayPlan, GapPeopleReason, PlanGap, PlanRoom } from '@shared/api/plan';

import { clockOf } from './lane-view';

/** What the gap panel says about a turnover's people, with a roster (null without one). */
export interface GapPeopleWords {
  /** "Short by 6 min: Aide 1 is in MR 2 until 10:12"; null when the crew was whole and on time. */
  reason: string | null;
  /** The crew by label ("Aide 1", "Sam Example"); empty when nobody could do it. */
  crew: string[];
}

/**
 * The people side of a gap in words: who works it and, when they started late or were fewer than
 * the room's staff, why ("Short by 6 min: Aide 1 is in MR 2 until 10:12", "Runs with 1 of 2
 * people: Aide 2 is on a break until 11:00", "Short by 20 min: nobody on the roster covers CT 1
 * then"). Null for a gap planned without the roster (no roster, or a room nobody covers).
 */
export function gapPeopleWords(plan: DayPlan, room: PlanRoom, gap: PlanGap): GapPeopleWords | null {
  if (!gap.crew) return null;
  const people = new Map((plan.people?.people ?? []).map((person) => [person.id, person.label]));
  const crew = gap.crew.map((id) => people.get(id) ?? id);
  const reason = gap.people ? reasonWords(gap, gap.people, room, plan, people) : null;
  return { reason, crew };
}

function reasonWords(gap: PlanGap, why: GapPeopleReason, room: PlanRoom, plan: DayPlan, people: ReadonlyMap<string, string>): string {
  const who = (why.personId && people.get(why.personId)) || 'a helper';
  const until = why.until ? clockOf(why.until) : '';
  const fewer = why.got > 0 && why.got < why.wanted ? `runs with ${why.got} of ${why.wanted} people` : null;
  let cause: string;
  switch (why.kind) {
    case 'busy': {
      const elsewhere = why.roomId !== null && why.roomId !== room.id ? plan.rooms.find((r) => r.id === why.roomId)?.name : null;
      cause = elsewhere ? `${who} is in ${elsewhere} until ${until}` : `${who} is busy until ${until}`;
      break;
    }
    case 'break':
      cause = `${who} is on a break until ${until}`;
      break;
    case 'off-shift':
      cause = until ? `${who} starts at ${until}` : `${who}'s shift is over`;
      break;
    case 'nobody':
      cause = why.got === 0 ? `nobody on the roster covers ${room.name} then` : `nobody else on the roster covers ${room.name}`;
      break;
  }
  const late = gap.shortByMinutes > 0 && (gap.verdict === 'short' || gap.verdict === 'overlap');
  const lead = late ? `Short by ${gap.shortByMinutes} min` : why.waitedMinutes > 0 ? `Starts ${why.waitedMinutes} min late` : null;
  if (lead) return `${lead}: ${fewer ? `${fewer}; ` : ''}${cause}`;
  return fewer ? `${capitalised(fewer)}: ${cause}` : capitalised(cause);
}

const capitalised = (words: string) => words.charAt(0).toUpperCase() + words.slice(1);

import type { DayPlan, PlanGap, PlanRoom } from '@shared/api/plan';
import { peopleReasonWords } from '@shared/turnover/people-words';

/** What the gap panel says about a turnover's people, with a roster (null without one). */
export interface GapPeopleWords {
  /** "Short by 6 min: Aide 1 is in MR 2 until 10:12"; null when the crew was whole and on time. */
  reason: string | null;
  /** The crew by label ("Aide 1", "Sam Example"); empty when nobody could do it. */
  crew: string[];
}

/**
 * The people side of a gap in words: who works it and, when they started late or were fewer than
 * the room's staff, why (`peopleReasonWords`, shared with the day-fit proposal's gaps left). Null
 * for a gap planned without the roster (no roster, or a room nobody covers).
 */
export function gapPeopleWords(plan: DayPlan, room: PlanRoom, gap: PlanGap): GapPeopleWords | null {
  if (!gap.crew) return null;
  const people = new Map((plan.people?.people ?? []).map((person) => [person.id, person.label]));
  const crew = gap.crew.map((id) => people.get(id) ?? id);
  const names = { roomName: (id: number) => plan.rooms.find((r) => r.id === id)?.name, personLabel: (id: string) => people.get(id) };
  const reason = gap.people ? peopleReasonWords(gap, gap.people, room.id, names) : null;
  return { reason, crew };
}

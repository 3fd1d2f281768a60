import type { GapPeopleReason, PlanGap } from './day-plan-types';

/** What the words need to know of the day: room and person names. */
export interface PeopleNames {
  roomName(roomId: number): string | undefined;
  personLabel(personId: string): string | undefined;
}

/**
 * A turnover's people reason in words, on a roster day: "Short by 6 min: Aide 1 is in MR 2 until
 * 10:12", "Runs with 1 of 2 people: Aide 2 is on a break until 11:00", "Short by 20 min: nobody
 * on the roster covers CT 1 then". Said by the gap panel and by a day-fit proposal's gaps left.
 *
 * @example
 * peopleReasonWords(gap, gap.people!, 1, names); // 'Short by 6 min: Aide 1 is in MR 2 until 10:12'
 */
export function peopleReasonWords(gap: Pick<PlanGap, 'verdict' | 'shortByMinutes'>, why: GapPeopleReason, roomId: number, names: PeopleNames): string {
  const who = (why.personId && names.personLabel(why.personId)) || 'a helper';
  const until = why.until ? clockOf(why.until) : '';
  const fewer = why.got > 0 && why.got < why.wanted ? `runs with ${why.got} of ${why.wanted} people` : null;
  const roomName = names.roomName(roomId) ?? 'this room';
  let cause: string;
  switch (why.kind) {
    case 'busy': {
      const elsewhere = why.roomId !== null && why.roomId !== roomId ? names.roomName(why.roomId) : null;
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
      cause = why.got === 0 ? `nobody on the roster covers ${roomName} then` : `nobody else on the roster covers ${roomName}`;
      break;
  }
  const late = gap.shortByMinutes > 0 && (gap.verdict === 'short' || gap.verdict === 'overlap');
  const lead = late ? `Short by ${gap.shortByMinutes} min` : why.waitedMinutes > 0 ? `Starts ${why.waitedMinutes} min late` : null;
  if (lead) return `${lead}: ${fewer ? `${fewer}; ` : ''}${cause}`;
  return fewer ? `${capitalised(fewer)}: ${cause}` : capitalised(cause);
}

/** The site clock time of an instant written with its offset ('…T10:12:00-05:00' → '10:12'). */
function clockOf(iso: string): string {
  return /^\d{4}-\d\d-\d\dT(\d\d:\d\d)/.exec(iso)?.[1] ?? '';
}

const capitalised = (words: string) => words.charAt(0).toUpperCase() + words.slice(1);

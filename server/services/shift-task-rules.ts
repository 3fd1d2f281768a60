import { DateTime } from 'luxon';
export { occurrencesOn, ruleOccurrences } from '../../shared/shift-tasks/recurrence';

export interface ShiftTaskDefault {
  key: string;
  label: string;
  rrule: string;
  durationMinutes: number;
}

/**
 * A rule at a local `HH:MM`, every day or on the given RFC 5545 weekdays, starting on `from`'s
 * date, or the next day when `from` is already past that time (so nothing falls due before the
 * room existed). Without `from` the rule starts on 1 January 2026 (the demo's rooms).
 */
function at(hhmm: string, byDay?: string, from?: DateTime): string {
  const [h, m] = hhmm.split(':');
  let date = '20260101';
  if (from) {
    const due = from.set({ hour: Number(h), minute: Number(m), second: 0, millisecond: 0 });
    date = (due < from ? due.plus({ days: 1 }) : due).toFormat('yyyyLLdd');
  }
  const start = `DTSTART:${date}T${h}${m}00`;
  return byDay ? `${start}\nRRULE:FREQ=WEEKLY;BYDAY=${byDay}` : `${start}\nRRULE:FREQ=DAILY`;
}

const minus = (hhmm: string, minutes: number) => DateTime.fromFormat(hhmm, 'HH:mm', { zone: 'UTC' }).minus({ minutes }).toFormat('HH:mm');
const plus = (hhmm: string, minutes: number) => minus(hhmm, -minutes);

/**
 * Our default shift tasks for a room (invented; each site sets its own): a workstation
 * wipe-down when the room opens and when it closes, the daily scanner QA just after opening,
 * and a weekly deep clean on Saturdays in the last hour. `from` (local to the site): when the
 * room is set up, so no occurrence falls due before it existed.
 */
export function defaultShiftTasks(room: { opensAt: string; closesAt: string }, from?: DateTime): ShiftTaskDefault[] {
  return [
    { key: 'wipe-start', label: 'Workstation wipe-down, start of shift', rrule: at(room.opensAt, undefined, from), durationMinutes: 5 },
    { key: 'scanner-qa', label: 'Daily scanner QA', rrule: at(plus(room.opensAt, 5), undefined, from), durationMinutes: 10 },
    { key: 'wipe-end', label: 'Workstation wipe-down, end of shift', rrule: at(room.closesAt, undefined, from), durationMinutes: 5 },
    { key: 'deep-clean', label: 'Weekly deep clean', rrule: at(minus(room.closesAt, 60), 'SA', from), durationMinutes: 60 },
  ];
}

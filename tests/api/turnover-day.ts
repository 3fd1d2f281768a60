import type { Checklist } from '../../shared/api/board';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import type { Client, Harness } from './harness';

/** Helpers for the board, checklist and log specs: a small invented day in MR 2. */
export const DAY = '2027-03-10'; // America/Chicago, standard time (-06:00); DST starts 14 March 2027
export const local = (hhmm: string) => `${DAY}T${hhmm}:00-06:00`;
/** Sets the harness clock to a local wall time of DAY. */
export const at = (h: Harness, hhmm: string) => h.clock.set(local(hhmm));

export const row = (acc: string, room: string, start: string, minutes: number, precaution = 'none', coil = 'knee', contrast = 'no') =>
  [acc, room, start, String(minutes), 'MR exam', coil, precaution, 'ambulatory', contrast, ''];

/** MR 2 (12 ACH in the demo centre): a plain exam, an airborne case, the day's last exam. */
export const MR2_DAY = [
  EXAM_LIST_HEADER,
  row('B-1', 'MR 2', '08:00', 30),
  row('B-2', 'MR 2', '09:00', 30, 'airborne'),
  row('B-3', 'MR 2', '10:30', 30),
];

export async function importDay(scheduler: Client, table: string[][] = MR2_DAY): Promise<void> {
  const res = await scheduler.upload(`/api/days/${DAY}/exams/import`, toCsv(table), 'day.csv');
  if (res.status !== 200) throw new Error(`import failed: ${res.status} ${JSON.stringify(res.body)}`);
}

export async function examId(h: Harness, accession: string): Promise<number> {
  return (await h.db('exams').where({ day: DAY, accession }).first('id')).id;
}

export async function roomId(h: Harness, name: string): Promise<number> {
  return (await h.db('rooms').where({ name }).first('id')).id;
}

/**
 * Ticks every step not yet done in the checklist's order, moving the clock on only when a step would
 * otherwise touch a wet surface (so no early reason is ever needed). Returns the last answer.
 */
export async function tickAll(h: Harness, c: Client, checklist: Checklist): Promise<Checklist> {
  let current = checklist;
  for (const key of checklist.steps.map((s) => s.key)) {
    const step = current.steps.find((s) => s.key === key)!;
    if (step.done) continue;
    const wetUntil = Math.max(0, ...step.needsDry.map((k) => Date.parse(current.steps.find((s) => s.key === k)!.wetUntil!)));
    if (wetUntil > h.clock.now().getTime()) h.clock.set(new Date(wetUntil));
    const res = await c.post(`/api/turnovers/${current.turnoverId}/steps/${key}/done`, {});
    if (res.status !== 200) throw new Error(`tick ${key}: ${res.status} ${JSON.stringify(res.body)}`);
    current = res.body;
  }
  return current;
}

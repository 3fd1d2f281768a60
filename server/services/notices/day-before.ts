import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { loadDayPlan } from '../day-plan';
import { readSettings } from '../settings';
import { problemGaps, type ProblemGap } from './import-digest';
import { recipients } from './preferences';
import { queueNotices } from './queue';
import { renderNotice, type NoticeContext } from './render';

/** An exam under a precaution other than standard, as the notice lists it. */
interface IsolationCase {
  room: string;
  at: string;
  accession: string;
  precaution: string;
}

/**
 * The day-before notice: once the site's clock passes `dayBeforeNoticeAt` (Setup → Site), one
 * message per charge technologist (notice on, an address) with tomorrow's short and overlapping
 * gaps and its isolation cases; nothing when tomorrow has neither. Keyed by tomorrow's date and
 * the recipient, so every later pass that day, and a restart, queues nothing more. A pass after
 * midnight belongs to the next day: a notice missed while the server was down is not sent late.
 * Returns how many were queued.
 */
export async function queueDayBeforeNotices(db: Knex, ctx: NoticeContext, now: Date): Promise<number> {
  const { timezone, dayBeforeNoticeAt } = await readSettings(db);
  const local = DateTime.fromJSDate(now, { zone: timezone });
  if (local.toFormat('HH:mm') < dayBeforeNoticeAt) return 0;
  const tomorrow = local.plus({ days: 1 }).toISODate()!;
  const people = await recipients(db, 'day-before', { roles: ['charge'] });
  if (people.length === 0) return 0;
  const fresh = await db('notices').whereIn('idempotency_key', people.map((p) => keyOf(tomorrow, p.id))).pluck('idempotency_key');
  const waiting = people.filter((p) => !fresh.includes(keyOf(tomorrow, p.id)));
  if (waiting.length === 0) return 0;

  const plan = await loadDayPlan(db, tomorrow);
  const gaps = problemGaps(plan);
  const cases: IsolationCase[] = plan.rooms.flatMap((room) =>
    room.exams
      .filter((e) => e.precaution !== 'none')
      .map((e) => ({ room: room.name, at: DateTime.fromISO(e.start, { zone: timezone }).toFormat('HH:mm'), accession: e.accession, precaution: e.precaution })),
  );
  if (gaps.length === 0 && cases.length === 0) return 0;

  const sections = [
    ...(gaps.length > 0 ? [{ heading: 'Problem gaps', lines: gaps.map(gapLine) }] : []),
    ...(cases.length > 0 ? [{ heading: 'Isolation cases', lines: cases.map((c) => `${c.room} ${c.at} ${c.accession}: ${c.precaution} precautions`) }] : []),
  ];
  const notices = waiting.map((p) => ({
    key: keyOf(tomorrow, p.id),
    kind: 'day-before' as const,
    userId: p.id,
    to: p.email,
    ...renderNotice(ctx, 'day-before', p.id, {
      subject: `Turnwise: tomorrow ${tomorrow}, ${count(gaps.length, 'problem gap')} and ${count(cases.length, 'isolation case')}`,
      intro: `Tomorrow, ${tomorrow} (site time): the turnovers that do not fit the time between exams, and the exams under precautions.`,
      sections,
      link: { label: `Day plan for ${tomorrow}`, url: `${ctx.publicUrl}/day/${tomorrow}` },
    }),
  }));
  return queueNotices(db, notices, now);
}

const keyOf = (day: string, userId: number) => `day-before:${day}:${userId}`;

const count = (n: number, what: string) => `${n} ${what}${n === 1 ? '' : 's'}`;

function gapLine(g: ProblemGap): string {
  const what = g.verdict === 'overlap' ? `overlaps the exam before by ${-g.availableMinutes} min` : `short by ${g.shortByMinutes} min`;
  return `${g.room} ${g.at} before ${g.accession}: ${what}`;
}

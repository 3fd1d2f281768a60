import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import { buildReport } from '../reports';
import { readSettings } from '../settings';
import { recipients } from './preferences';
import { queueNotices } from './queue';
import { renderNotice, type NoticeContext } from './render';

/** Site time on Mondays from which last week's summary goes out (the first pass after it sends). */
export const WEEKLY_SUMMARY_AT = '07:00';

/**
 * The weekly summary for admins (notice on, an address): last week's (Monday to Sunday, site
 * time) turnovers closed early and their reasons, disinfection steps whose contact time was below
 * the product's, and shift tasks never ticked off or ticked off late, all from the Reports
 * numbers (`buildReport`). Queued on Monday from {@link WEEKLY_SUMMARY_AT} on; keyed by the week
 * and the recipient, so later passes and restarts queue nothing more. Returns how many were queued.
 */
export async function queueWeeklySummaries(db: Knex, ctx: NoticeContext, now: Date): Promise<number> {
  const { timezone } = await readSettings(db);
  const local = DateTime.fromJSDate(now, { zone: timezone });
  if (local.weekday !== 1 || local.toFormat('HH:mm') < WEEKLY_SUMMARY_AT) return 0;
  const from = local.minus({ weeks: 1 }).startOf('week').toISODate()!;
  const to = local.minus({ weeks: 1 }).endOf('week').toISODate()!;
  const people = await recipients(db, 'weekly-summary', { roles: ['admin'] });
  const sent = await db('notices').whereIn('idempotency_key', people.map((p) => keyOf(from, p.id))).pluck('idempotency_key');
  const waiting = people.filter((p) => !sent.includes(keyOf(from, p.id)));
  if (waiting.length === 0) return 0;

  const report = await buildReport(db, { from, to }, now);
  const { earlyCloses, contact, shiftTasks } = report;
  const sections = [
    {
      heading: 'Turnovers closed early',
      lines: [
        `${earlyCloses.early} of ${earlyCloses.closed} turnovers closed with an override reason`,
        ...earlyCloses.reasons.map((r) => `"${r.reason}": ${r.count}`),
      ],
    },
    {
      heading: 'Contact time',
      lines: [
        `${contact.total.below} of ${contact.total.steps} disinfection steps below the product's required contact time`,
        ...contact.byProduct.filter((p) => p.below > 0).map((p) => `${p.label}: ${p.below} of ${p.steps} below ${p.requiredMinutes} min`),
      ],
    },
    {
      heading: 'Shift tasks',
      lines: [`${shiftTasks.missed} overdue (never ticked off) and ${shiftTasks.late} ticked off late, of ${shiftTasks.due} due`],
    },
  ];
  const notices = waiting.map((p) => ({
    key: keyOf(from, p.id),
    kind: 'weekly-summary' as const,
    userId: p.id,
    to: p.email,
    ...renderNotice(ctx, 'weekly-summary', p.id, {
      subject: `Turnwise: week of ${from}, ${earlyCloses.early} early close${earlyCloses.early === 1 ? '' : 's'}, ${contact.total.below} below contact time, ${shiftTasks.missed} overdue task${shiftTasks.missed === 1 ? '' : 's'}`,
      intro: `The week ${from} to ${to} (site time), from the Reports numbers.`,
      sections,
      link: { label: `Reports for ${from} to ${to}`, url: `${ctx.publicUrl}/reports?from=${from}&to=${to}` },
    }),
  }));
  return queueNotices(db, notices, now);
}

const keyOf = (weekStart: string, userId: number) => `weekly-summary:${weekStart}:${userId}`;

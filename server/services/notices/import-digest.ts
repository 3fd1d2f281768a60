import type { Knex } from 'knex';
import { DateTime } from 'luxon';
import type { PlannedDay } from '../../../shared/api/plan';
import { loadDayPlan } from '../day-plan';
import { queueNotices } from './queue';
import { recipients } from './preferences';
import { renderNotice, type NoticeContext } from './render';

/** A gap worth a digest line: short or overlapping. */
export interface ProblemGap {
  room: string;
  /** HH:MM, site time, when the next exam starts. */
  at: string;
  accession: string;
  verdict: 'short' | 'overlap';
  shortByMinutes: number;
  requiredMinutes: number;
  availableMinutes: number;
}

export function problemGaps(plan: PlannedDay): ProblemGap[] {
  const out: ProblemGap[] = [];
  for (const room of plan.rooms) {
    const exams = new Map(room.exams.map((e) => [e.id, e]));
    for (const gap of room.gaps) {
      if (gap.verdict !== 'short' && gap.verdict !== 'overlap') continue;
      const exam = exams.get(gap.toExamId);
      if (!exam) continue;
      out.push({
        room: room.name,
        at: DateTime.fromISO(exam.start, { zone: plan.timezone }).toFormat('HH:mm'),
        accession: exam.accession,
        verdict: gap.verdict,
        shortByMinutes: gap.shortByMinutes,
        requiredMinutes: gap.requiredMinutes,
        availableMinutes: gap.availableMinutes,
      });
    }
  }
  return out;
}

/**
 * After an import: one digest per charge technologist and the importing user (each with the
 * notice on and an address) listing the day's short and overlapping gaps, or nothing when the
 * day has none. Keyed by the import, so the same import never queues twice. Returns how many
 * were queued.
 */
export async function queueImportDigest(db: Knex, ctx: NoticeContext, input: { day: string; userId: number; now: Date }): Promise<number> {
  const importRow = await db('imports').where({ day: input.day, user_id: input.userId }).orderBy('id', 'desc').first('id');
  if (!importRow) return 0;
  const plan = await loadDayPlan(db, input.day);
  const gaps = problemGaps(plan);
  if (gaps.length === 0) return 0;
  const people = await recipients(db, 'import-digest', { roles: ['charge'], ids: [input.userId] });
  const link = `${ctx.publicUrl}/day/${input.day}`;
  const byRoom = new Map<string, ProblemGap[]>();
  for (const g of gaps) byRoom.set(g.room, [...(byRoom.get(g.room) ?? []), g]);
  const count = `${gaps.length} problem gap${gaps.length === 1 ? '' : 's'}`;
  const notices = people.map((p) => {
    const rendered = renderNotice(ctx, 'import-digest', p.id, {
      subject: `Turnwise: ${count} on ${input.day} after an import`,
      intro: `The list for ${input.day} was imported. These turnovers do not fit the time between exams (site time). Open the day plan to see the suggested fixes for each gap.`,
      sections: [...byRoom].map(([room, list]) => ({ heading: room, lines: list.map(gapLine) })),
      link: { label: `Day plan for ${input.day}`, url: link },
    });
    return { key: `import-digest:${importRow.id}:${p.id}`, kind: 'import-digest' as const, userId: p.id, to: p.email, ...rendered };
  });
  return queueNotices(db, notices, input.now);
}

function gapLine(g: ProblemGap): string {
  const what = g.verdict === 'overlap' ? `overlaps the exam before by ${-g.availableMinutes} min` : `short by ${g.shortByMinutes} min`;
  return `${g.at} before ${g.accession}: ${what} (turnover needs ${g.requiredMinutes} min, ${Math.max(0, g.availableMinutes)} min available)`;
}

/**
 * The import route's call: queues the digest when notices are on, and never fails the import
 * (an error is logged; the list is already stored).
 */
export async function digestAfterImport(
  db: Knex,
  notices: { mailer: { delivery: string }; context: NoticeContext } | undefined,
  input: { day: string; userId: number; now: Date },
  logError: (err: unknown) => void = console.error,
): Promise<void> {
  if (!notices || notices.mailer.delivery === 'off') return;
  try {
    await queueImportDigest(db, notices.context, input);
  } catch (err) {
    logError(err);
  }
}

import type { Knex } from 'knex';
import type { Test } from 'supertest';
import type { ExamListRow } from '../../../shared/exam-list';
import { expectSound, send } from './answer';
import { DAY } from './fuzz-app';

/** The day's exams as stored, every column, in id order. */
export async function dayExams(db: Knex, day = DAY): Promise<Record<string, unknown>[]> {
  return (await db('exams').where({ day }).orderBy('id')).map((row) => ({ ...row }));
}

async function importCount(db: Knex): Promise<number> {
  return Number((await db('imports').count({ n: '*' }))[0]!.n);
}

/** What a stored exam and a reported row share, in one shape, sorted by accession. */
function comparable(rows: { accession: string; room: string; start: string; durationMinutes: number; procedure: string; coil: string | null; precaution: string; mobility: string; contrast: boolean; notes: string | null }[]) {
  return rows
    .map((r) => ({ accession: r.accession, room: r.room, start: r.start, durationMinutes: r.durationMinutes, procedure: r.procedure, coil: r.coil, precaution: r.precaution, mobility: r.mobility, contrast: Boolean(r.contrast), notes: r.notes }))
    .sort((a, b) => (a.accession < b.accession ? -1 : a.accession > b.accession ? 1 : 0));
}

/**
 * Sends one import and checks the import's properties: never a 5xx (and the usual error shape);
 * a refusal (any 4xx) or a preview leaves the day's exams exactly as they were and records no
 * import; a 200 commit stores exactly the rows it reports, no more and no fewer.
 */
export async function expectSoundImport(db: Knex, test: Test, what: string, logged: () => string, options: { dryRun: boolean }): Promise<number> {
  const before = await dayExams(db);
  const importsBefore = await importCount(db);
  const answer = await send(test);
  expectSound(answer, what, logged);
  const after = await dayExams(db);
  const fail = (problem: string) => {
    throw new Error(`${what}: ${answer.status} but ${problem}\n${answer.text.slice(0, 400)}`);
  };
  if (answer.status !== 200 || options.dryRun) {
    if (JSON.stringify(after) !== JSON.stringify(before)) fail('the day changed');
    if ((await importCount(db)) !== importsBefore) fail('an import was recorded');
    return answer.status;
  }
  const result = answer.json as { dryRun: boolean; imported: number; rows: ExamListRow[] };
  const rooms = new Map(((await db('rooms').select('id', 'name')) as { id: number; name: string }[]).map((r) => [r.id, r.name]));
  const stored = comparable(
    after.map((e) => ({
      accession: String(e['accession']),
      room: rooms.get(Number(e['room_id'])) ?? '?',
      start: String(e['start_at']),
      durationMinutes: Number(e['duration_minutes']),
      procedure: String(e['procedure']),
      coil: (e['coil'] as string | null) ?? null,
      precaution: String(e['precaution']),
      mobility: String(e['mobility']),
      contrast: Boolean(e['contrast']),
      notes: (e['notes'] as string | null) ?? null,
    })),
  );
  if (result.dryRun !== false) fail('it says dryRun');
  if (result.imported !== result.rows.length) fail(`it reports ${result.imported} imported but lists ${result.rows.length} rows`);
  if (JSON.stringify(stored) !== JSON.stringify(comparable(result.rows))) fail(`the stored exams differ from the ${result.rows.length} rows reported`);
  if ((await importCount(db)) !== importsBefore + 1) fail('no import was recorded');
  return answer.status;
}

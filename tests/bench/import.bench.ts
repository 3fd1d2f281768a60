import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import { createDb, migrateToLatest } from '../../server/db';
import { importExamList } from '../../server/services/exam-import';
import { seedDemo, seedReferenceData } from '../../server/seeding';
import { EXAM_LIST_HEADER, toCsv } from '../fixtures/exam-lists';
import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';
import { createWorkerPool } from '../../server/workers/pool';

// The most a day list may hold (EXAM_FILE_LIMITS.maxRows, header included).
const ROWS = EXAM_FILE_LIMITS.maxRows - 1;
const DAY = '2027-03-10';
const TARGET_RATIO = 3;

/** An invented list of the largest allowed size over the four demo rooms: back-to-back 5-minute slots from 00:00. */
function bigCsv(): string {
  const rooms = ['MR 1', 'MR 2', 'MR 3', 'CT 1'];
  const table = [EXAM_LIST_HEADER];
  for (let i = 0; i < ROWS; i++) {
    const room = rooms[i % rooms.length]!;
    const minuteOfDay = Math.floor(i / rooms.length) % (24 * 12) * 5;
    const hh = String(Math.floor(minuteOfDay / 60)).padStart(2, '0');
    const mm = String(minuteOfDay % 60).padStart(2, '0');
    table.push([`BENCH-${i}`, room, `${hh}:${mm}`, '5', 'Invented procedure, for the benchmark', 'knee', 'none', 'ambulatory', 'no', '']);
  }
  return toCsv(table);
}

const ms = (t0: bigint) => Number(process.hrtime.bigint() - t0) / 1e6;

/** Import of the largest allowed CSV end to end (through the worker thread) (read, validate, diff, plan, one transaction) vs csv-parse alone. */
export async function benchImport(): Promise<string[]> {
  const csv = Buffer.from(bigCsv());
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'turnwise-bench-'));
  const db = createDb(path.join(dir, 'bench.sqlite'));
  const workers = createWorkerPool();
  try {
    await migrateToLatest(db);
    await seedReferenceData(db);
    await seedDemo(db, new Date('2027-03-10T12:00:00Z'), { day: false });
    const user = await db('users').where({ username: 'scheduler' }).first();

    parse(csv, { bom: true, relax_column_count: true });
    let t0 = process.hrtime.bigint();
    parse(csv, { bom: true, relax_column_count: true });
    const parseOnly = ms(t0);

    const file = { buffer: csv, originalname: 'bench.csv', mimetype: 'text/csv' };
    await importExamList(db, workers, { day: DAY, file, userId: user.id, dryRun: true, now: new Date() }); // starts the worker
    t0 = process.hrtime.bigint();
    const dry = await importExamList(db, workers, { day: DAY, file, userId: user.id, dryRun: true, now: new Date() });
    const dryRun = ms(t0);
    t0 = process.hrtime.bigint();
    await importExamList(db, workers, { day: DAY, file, userId: user.id, dryRun: false, now: new Date() });
    const commit = ms(t0);
    const ratio = dryRun / parseOnly;
    return [
      `import: ${ROWS} rows (${(csv.length / 1024).toFixed(0)} kB) — csv-parse alone ${parseOnly.toFixed(1)} ms`,
      `import: dry run end to end ${dryRun.toFixed(1)} ms (${ratio.toFixed(1)}× csv-parse; target ≤ ${TARGET_RATIO}×${ratio <= TARGET_RATIO ? '' : ', OVER TARGET'}); ${dry.summary.overlap} overlaps found`,
      `import: committing import (adds ${ROWS} exams in one transaction) ${commit.toFixed(1)} ms (${(commit / parseOnly).toFixed(1)}× csv-parse)`,
    ];
  } finally {
    await workers.close();
    await db.destroy();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

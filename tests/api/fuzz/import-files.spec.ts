import fc from 'fast-check';
import { exampleCsv, exampleXlsx, toXlsx } from '../../fixtures/exam-lists';
import type { Client } from '../harness';
import { csvishFile, editedCsv, editedWorkbook, randomBytesFile, workbookTable, type FuzzFile } from './exam-files';
import { DAY, startFuzzApp, type FuzzApp } from './fuzz-app';
import { fuzzOptions, fuzzTimeout } from './fuzz-runs';
import { expectSoundImport } from './import-check';

/**
 * Files for `POST /api/days/:date/exams/import`: random bytes, CSV-ish text, edits of a good CSV,
 * damaged workbooks and workbooks of odd tables. Never a 5xx; a refusal leaves the day exactly
 * as it was; a 200 stores exactly the rows it reports.
 */
const RUNS = { bytes: 80, csvish: 200, editedCsv: 150, editedWorkbook: 120, workbookTables: 60 };

describe('fuzz: exam-list files', () => {
  let app: FuzzApp;
  let scheduler: Client;
  let workbook: Buffer;
  const statuses: Record<string, Record<number, number>> = {};

  beforeAll(async () => {
    app = await startFuzzApp();
    scheduler = app.clients.get('scheduler')!;
    workbook = await exampleXlsx(DAY);
    expect((await scheduler.upload(`/api/days/${DAY}/exams/import`, exampleCsv(DAY), 'day.csv')).status).toBe(200);
  }, 30_000);
  afterAll(() => app.close(), 30_000);

  const dryRun = fc.oneof({ arbitrary: fc.constant(false), weight: 3 }, { arbitrary: fc.constant(true), weight: 1 });

  async function upload(kind: string, file: FuzzFile, preview: boolean) {
    const url = `/api/days/${DAY}/exams/import${preview ? '?dryRun=true' : ''}`;
    const test = scheduler.agent
      .post(url)
      .set('X-XSRF-TOKEN', scheduler.token)
      .attach('file', file.bytes, { filename: file.name, contentType: file.type || undefined });
    const what = `${kind} ${url} ${file.name} (${file.type}, ${file.bytes.length} bytes: ${JSON.stringify(file.bytes.subarray(0, 200).toString('latin1'))})`;
    const status = await expectSoundImport(app.h.db, test, what, app.lastError, { dryRun: preview });
    (statuses[kind] ??= {})[status] = (statuses[kind]![status] ?? 0) + 1;
  }

  function fuzzFiles(kind: keyof typeof RUNS, files: () => fc.Arbitrary<FuzzFile>) {
    it(`${kind}: never a 5xx, a refusal changes nothing, a 200 stores what it reports`, async () => {
      await fc.assert(
        fc.asyncProperty(files(), dryRun, (file, preview) => upload(kind, file, preview)),
        fuzzOptions(RUNS[kind]),
      );
    }, fuzzTimeout(RUNS[kind]));
  }

  fuzzFiles('bytes', () => randomBytesFile);
  fuzzFiles('csvish', () => csvishFile);
  fuzzFiles('editedCsv', () => editedCsv);
  fuzzFiles('editedWorkbook', () => editedWorkbook(workbook));

  it('workbookTables: odd tables as real workbooks', async () => {
    await fc.assert(
      fc.asyncProperty(workbookTable, dryRun, async (table, preview) => {
        await upload('workbookTables', { bytes: await toXlsx(table), name: 'day.xlsx', type: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' }, preview);
      }),
      fuzzOptions(RUNS.workbookTables),
    );
  }, fuzzTimeout(RUNS.workbookTables));

  it('reached both answers: some files imported, some refused', () => {
    // A fuzz that only ever hits one branch proves little; this keeps the generators honest.
    const all = Object.values(statuses).flatMap((byStatus) => Object.entries(byStatus));
    if (process.env['FUZZ_STATS']) process.stderr.write(`import statuses ${JSON.stringify(statuses)}\n`);
    expect(all.some(([status]) => status === '200')).toBe(true);
    expect(all.some(([status]) => status.startsWith('4'))).toBe(true);
  });
});

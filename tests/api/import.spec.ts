import crypto from 'node:crypto';
import { exampleCsv, exampleExamTable, toCsv, toXlsx } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';

const DAY = '2027-03-10';
const importUrl = (day = DAY, dryRun = false) => `/api/days/${day}/exams/import${dryRun ? '?dryRun=true' : ''}`;

describe('exam-list import API', () => {
  let h: Harness;
  let scheduler: Client;
  beforeEach(async () => {
    h = await startHarness();
    scheduler = await signedIn(h.app, 'scheduler');
  });
  afterEach(() => h.close());

  const dayExams = async (day = DAY) => (await h.db('exams').where({ day }).orderBy('accession')).map((e) => ({ ...e }));

  it('previews a good CSV without storing it, then imports it', async () => {
    const preview = await scheduler.upload(importUrl(DAY, true), exampleCsv(DAY, { bom: true }), 'day.csv');
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ dryRun: true, imported: 10, removed: [], changed: [] });
    expect(preview.body.added).toHaveLength(10);
    expect(preview.body.summary.fits + preview.body.summary.snug + preview.body.summary.short + preview.body.summary.overlap).toBe(10);
    expect(await dayExams()).toEqual([]);

    const done = await scheduler.upload(importUrl(), exampleCsv(DAY), 'day.csv');
    expect(done.status).toBe(200);
    expect(done.body.dryRun).toBe(false);
    expect(await dayExams()).toHaveLength(10);
    const record = await h.db('imports').first();
    expect(record).toMatchObject({ day: DAY, file_name: 'day.csv', rows: 10, added: 10 });
  });

  it('shows what a re-import adds, changes and removes, and keeps ids of unchanged exams', async () => {
    await scheduler.upload(importUrl(), exampleCsv(DAY), 'day.csv');
    const before = await dayExams();
    const table = exampleExamTable(DAY);
    table[1]![2] = '07:35'; // exam 1 moves
    table.splice(2, 1); // exam 2 dropped
    table.push([`TW-NEW-1`, 'CT 1', '12:00', '15', 'CT sinus', '', 'none', 'ambulatory', 'no', '']);
    const res = await scheduler.upload(importUrl(), toCsv(table), 'day-v2.csv');
    expect(res.status).toBe(200);
    expect(res.body.added).toEqual(['TW-NEW-1']);
    expect(res.body.removed).toEqual([exampleExamTable(DAY)[2]![0]]);
    // The start as the day has it (the example file's 07:30) and as the new file has it, with the site's offset.
    expect(res.body.changed).toEqual([{ accession: table[1]![0], fields: ['start'], values: [{ column: 'start', from: `${DAY}T07:30:00-06:00`, to: `${DAY}T07:35:00-06:00` }] }]);
    const after = await dayExams();
    const moved = after.find((e) => e.accession === table[1]![0])!;
    expect(moved.id).toBe(before.find((e) => e.accession === table[1]![0])!.id);
    expect(moved.version).toBe(2);
    const untouched = after.find((e) => e.accession === table[3]![0])!;
    expect(untouched.version).toBe(1);
  });

  describe('refuses bad files whole and leaves the day unchanged', () => {
    let original: unknown[];
    beforeEach(async () => {
      await scheduler.upload(importUrl(), exampleCsv(DAY), 'day.csv');
      original = await dayExams();
    });
    afterEach(async () => {
      expect(await dayExams()).toEqual(original);
    });

    const withRow = (mutate: (t: string[][]) => void) => {
      const t = exampleExamTable(DAY);
      mutate(t);
      return toCsv(t);
    };

    it('random bytes → 415', async () => {
      const res = await scheduler.upload(importUrl(), crypto.randomBytes(4096), 'day.csv');
      expect(res.status).toBe(415);
      expect(res.body.error.code).toBe('file_refused');
      expect(res.body.error.message).toMatch(/CSV|xlsx/i);
    });

    it('a 6 MB file → 413', async () => {
      const big = Buffer.alloc(6 * 1024 * 1024, 'a');
      const res = await scheduler.upload(importUrl(), big, 'day.csv');
      expect(res.status).toBe(413);
    });

    it('a PDF → 415', async () => {
      const res = await scheduler.upload(importUrl(), '%PDF-1.4\n', 'day.pdf');
      expect(res.status).toBe(415);
    });

    it('an empty file and a header-only file → 422', async () => {
      for (const text of ['', 'accession,room,start,duration_min,procedure\r\n']) {
        const res = await scheduler.upload(importUrl(), text, 'day.csv');
        expect([res.status, res.body.error.code]).toEqual([422, 'file_refused']);
      }
    });

    it('a wrong header → 422 naming the missing column', async () => {
      const res = await scheduler.upload(importUrl(), 'acc,room,start,duration_min,procedure\r\nX,MR 1,08:00,30,MR knee\r\n', 'day.csv');
      expect(res.status).toBe(422);
      expect(res.body.errors.some((e: { message: string }) => /accession/.test(e.message))).toBe(true);
    });

    it('lists every error by row and column: duplicate accession, unknown room, 25:00, bad duration', async () => {
      const csv = withRow((t) => {
        t[2]![0] = t[1]![0]!; // duplicate accession on row 3
        t[3]![1] = 'MR 9'; // unknown room on row 4
        t[4]![2] = '25:00'; // row 5
        t[5]![3] = '481'; // row 6
      });
      const res = await scheduler.upload(importUrl(), csv, 'day.csv');
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('validation_failed');
      const cells = res.body.errors.map((e: { row: number; column: string }) => `${e.row}:${e.column}`);
      expect(cells).toEqual(expect.arrayContaining(['3:accession', '4:room', '5:start', '6:duration_min']));
      expect(res.body.error.message).toMatch(/not imported/);
      expect(res.body.table[0]).toEqual(exampleExamTable(DAY)[0]);
    });

    it('a local time that does not exist on a spring-forward day → 422', async () => {
      // America/Chicago skips 02:00→03:00 on 14 March 2027 (check-values.md; tz database).
      const day = '2027-03-14';
      const res = await scheduler.upload(
        importUrl(day),
        'accession,room,start,duration_min,procedure\r\nDST-1,MR 1,02:30,30,MR knee\r\n',
        'day.csv',
      );
      expect(res.status).toBe(422);
      expect(res.body.errors[0]).toMatchObject({ row: 2, column: 'start' });
      expect(res.body.errors[0].message).toMatch(/does not exist/);
    });
  });

  it('stores formula-looking cells as plain text, never evaluated', async () => {
    const t = exampleExamTable(DAY);
    t[1]![4] = '=HYPERLINK("http://example.invalid","x")';
    t[1]![9] = '@SUM(1+1)';
    const res = await scheduler.upload(importUrl(), toCsv(t), 'day.csv');
    expect(res.status).toBe(200);
    const row = await h.db('exams').where({ accession: t[1]![0] }).first();
    expect(row.procedure).toBe('=HYPERLINK("http://example.invalid","x")');
    expect(row.notes).toBe('@SUM(1+1)');
  });

  it('gives the same plan from a CSV and an XLSX of the same list', async () => {
    await scheduler.upload(importUrl(), exampleCsv(DAY), 'day.csv');
    const fromCsv = (await scheduler.get(`/api/days/${DAY}/plan`)).body;
    const res = await scheduler.upload(importUrl(), await toXlsx(exampleExamTable(DAY)), 'day.xlsx');
    expect(res.status).toBe(200);
    expect(res.body.changed).toEqual([]);
    const fromXlsx = (await scheduler.get(`/api/days/${DAY}/plan`)).body;
    expect(fromXlsx).toEqual(fromCsv);
  });

  it('refuses a bad date and a missing file', async () => {
    expect((await scheduler.upload('/api/days/2027-02-30/exams/import', exampleCsv(DAY), 'day.csv')).status).toBe(422);
    expect((await scheduler.post(importUrl())).status).toBe(422);
  });
});

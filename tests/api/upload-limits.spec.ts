import crypto from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import ExcelJS from 'exceljs';
import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';
import { EXAM_LIST_HEADER, exampleCsv, toCsv } from '../fixtures/exam-lists';
import { buildZip, deflated, repeatedDeflate, workbookShell } from '../fixtures/zip-builder';
import { signedIn, startHarness, type Client, type Harness } from './harness';

// Every file here is built in the test: none is checked in. Each must be refused with a 4xx that
// names its limit, the day must be left as it was, and the server must keep answering meanwhile.
const DAY = '2027-03-10';
const importUrl = (dryRun = false) => `/api/days/${DAY}/exams/import${dryRun ? '?dryRun=true' : ''}`;
const MB = 1024 * 1024;

describe('upload limits: no file can crash or freeze the server', () => {
  let h: Harness;
  let scheduler: Client;
  let before: unknown[];

  beforeAll(async () => {
    h = await startHarness();
    scheduler = await signedIn(h.app, 'scheduler');
    expect((await scheduler.upload(importUrl(), exampleCsv(DAY), 'day.csv')).status).toBe(200);
    before = await dayExams();
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  async function dayExams() {
    return (await h.db('exams').where({ day: DAY }).orderBy('id')).map((e) => ({ ...e }));
  }

  async function refused(content: Buffer | string, name: string, status: number, limit?: string) {
    const res = await scheduler.upload(importUrl(), content, name);
    expect({ status: res.status, limit: res.body.error?.details?.limit }).toEqual({ status, limit });
    expect(res.body.error.message).toEqual(expect.any(String));
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts:\d+/); // never a stack trace
    expect(await dayExams()).toEqual(before);
    return res;
  }

  describe('workbooks that unpack to far more than they weigh', () => {
    it('one 100 MB shared string → 413 naming the unpacked-size limit', async () => {
      const zip = buildZip([...workbookShell(), repeatedDeflate('xl/sharedStrings.xml', Buffer.alloc(MB, 'a'), 100)]);
      expect(zip.length).toBeLessThan(MB);
      await refused(zip, 'day.xlsx', 413, 'maxUnpackedEntryBytes');
    });

    it('a sheet of a gigabyte of spaces → 413', async () => {
      const zip = buildZip([...workbookShell(), repeatedDeflate('xl/worksheets/sheet1.xml', Buffer.alloc(16 * MB, ' '), 64)]);
      await refused(zip, 'day.xlsx', 413, 'maxUnpackedEntryBytes');
    });

    it('many parts that add up past the total → 413', async () => {
      // Each part packs about 100:1 (8 kB of noise a megabyte), within the ratio limit.
      const chunk = Buffer.concat([crypto.randomBytes(8 * 1024), Buffer.alloc(MB - 8 * 1024)]);
      const parts = Array.from({ length: 5 }, (_, i) => repeatedDeflate(`xl/media/pad${i}.bin`, chunk, 12));
      await refused(buildZip([...workbookShell(), ...parts]), 'day.xlsx', 413, 'maxUnpackedTotalBytes');
    });

    it('a part that lies about its size is caught while unpacking → 422, unpacking stops early', async () => {
      const bomb = { ...repeatedDeflate('xl/worksheets/sheet1.xml', Buffer.alloc(16 * MB, ' '), 64), declaredSize: 1000 };
      await refused(buildZip([...workbookShell(), bomb]), 'day.xlsx', 422);
    });

    it('a part packed beyond the allowed ratio → 413', async () => {
      await refused(buildZip([...workbookShell(), repeatedDeflate('xl/worksheets/sheet1.xml', Buffer.alloc(2 * MB, ' '), 1)]), 'day.xlsx', 413, 'maxCompressionRatio');
    });

    it('more files inside than any workbook has → 413', async () => {
      const parts = Array.from({ length: EXAM_FILE_LIMITS.maxZipEntries + 1 }, (_, i) => deflated(`xl/p${i}.xml`, '<x/>'));
      await refused(buildZip(parts), 'day.xlsx', 413, 'maxZipEntries');
    });

    it('a sheet with more rows than a day list has → 422 naming the row limit', async () => {
      const workbook = new ExcelJS.Workbook();
      const sheet = workbook.addWorksheet('Day');
      sheet.addRow(EXAM_LIST_HEADER);
      for (let i = 0; i < EXAM_FILE_LIMITS.maxRows + 10; i++) sheet.addRow([`A${i}`, 'MR 1', '08:00', 30, 'MR knee']);
      const buffer = Buffer.from(await workbook.xlsx.writeBuffer());
      await refused(buffer, 'day.xlsx', 422, 'maxRows');
    });
  });

  describe('CSV files that used to take a minute', () => {
    it('a million blank lines → 422 naming the row limit', async () => {
      await refused(`${EXAM_LIST_HEADER.join(',')}\n${'\n'.repeat(1_000_000)}`, 'day.csv', 422, 'maxRows');
    });

    it('two megabytes of one-cell rows → 422, not five million listed errors', async () => {
      const res = await refused(`${EXAM_LIST_HEADER.join(',')}\n${'x\n'.repeat(MB)}`, 'day.csv', 422, 'maxRows');
      expect(JSON.stringify(res.body).length).toBeLessThan(10_000);
    });

    it('a row of 130,000 stray cells → 422 naming the cell limit (no stack overflow)', async () => {
      const row = ['A1', 'MR 1', '08:00', '30', 'MR knee', ...Array.from({ length: 130_000 }, () => 'x')];
      await refused(toCsv([EXAM_LIST_HEADER, row]), 'day.csv', 422, 'maxCellsPerRow');
    });

    it('a cell longer than any column allows → 422 naming the cell limit', async () => {
      const row = ['A1', 'MR 1', '08:00', '30', 'MR knee', '', '', '', '', 'n'.repeat(EXAM_FILE_LIMITS.maxCellChars + 1)];
      await refused(toCsv([EXAM_LIST_HEADER, row]), 'day.csv', 422, 'maxCellChars');
    });

    it('lists the first 200 errors and counts them all', async () => {
      const rows = Array.from({ length: 1500 }, (_, i) => [`B${i}`, 'Nowhere', '08:00', '30', 'MR knee']);
      const res = await refused(toCsv([EXAM_LIST_HEADER, ...rows]), 'day.csv', 422);
      expect(res.body.errors).toHaveLength(EXAM_FILE_LIMITS.maxErrorsListed);
      expect(res.body.errorCount).toBe(1500);
      expect(res.body.error.message).toMatch(/1,500 problems/);
    });
  });

  describe('malformed multipart bodies are 400s, never 500s', () => {
    const raw = (contentType: string, body: string) =>
      scheduler.agent.post(importUrl()).set('X-XSRF-TOKEN', scheduler.token).set('Content-Type', contentType).send(body);
    const part = (boundary: string) => `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="day.csv"\r\nContent-Type: text/csv\r\n\r\naccession,room\r\n`;

    it.each([
      ['a truncated body', 'multipart/form-data; boundary=XyZ', part('XyZ')],
      ['no boundary', 'multipart/form-data', part('XyZ')],
      ['a different boundary', 'multipart/form-data; boundary=Other', `${part('XyZ')}--XyZ--\r\n`],
      ['a broken part header', 'multipart/form-data; boundary=XyZ', '--XyZ\r\nContent-Disposition\r\n\r\nx\r\n--XyZ--\r\n'],
    ])('%s → 400', async (_what, contentType, body) => {
      const res = await raw(contentType, body);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('bad_upload');
      expect(await dayExams()).toEqual(before);
    });

    it('two files → 400', async () => {
      const res = await scheduler.agent
        .post(importUrl())
        .set('X-XSRF-TOKEN', scheduler.token)
        .attach('file', Buffer.from('a'), 'a.csv')
        .attach('file', Buffer.from('b'), 'b.csv');
      expect(res.status).toBe(400);
    });
  });

  it('keeps answering other requests while a bomb is being refused', async () => {
    const server = http.createServer(h.app).listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    try {
      const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      const heapBefore = process.memoryUsage().heapUsed;
      const bomb = buildZip([...workbookShell(), { ...repeatedDeflate('xl/worksheets/sheet1.xml', Buffer.alloc(16 * MB, ' '), 64), declaredSize: 1000 }]);
      const upload = request(base).post(importUrl()).set('Cookie', await cookies(scheduler)).set('X-XSRF-TOKEN', scheduler.token).attach('file', bomb, 'day.xlsx');
      const health = Array.from({ length: 5 }, () => request(base).get('/api/health'));
      const [refusal, ...answers] = await Promise.all([upload, ...health]);
      expect(refusal.status).toBe(422);
      expect(answers.map((a) => a.status)).toEqual([200, 200, 200, 200, 200]);
      // The gigabyte was never held by the server's own thread.
      expect(process.memoryUsage().heapUsed - heapBefore).toBeLessThan(200 * MB);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  }, 30_000);
});

async function cookies(c: Client): Promise<string> {
  const jar = (c.agent as unknown as { jar: { getCookies(access: object): { toValueString(): string }[] } }).jar;
  return jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }).map((k) => k.toValueString()).join('; ');
}

import { Workbook } from 'exceljs';
import { parseExamTable } from '../../shared/exam-list';
import {
  DEMO_ROOM_NAMES,
  exampleCsv,
  exampleExamTable,
  exampleXlsx,
  excelTime,
  toXlsx,
} from '../../tests/fixtures/exam-lists';
import { HttpError } from '../errors';
import { readExamFile } from './exam-file';

const DATE = '2027-03-15';
const CSV_MIME = 'text/csv';
const XLSX_MIME = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';

function csv(text: string | Buffer, originalname = 'day.csv') {
  return readExamFile({ buffer: Buffer.isBuffer(text) ? text : Buffer.from(text, 'utf8'), originalname, mimetype: CSV_MIME });
}

function xlsx(buffer: Buffer, originalname = 'day.xlsx') {
  return readExamFile({ buffer, originalname, mimetype: XLSX_MIME });
}

/** Deterministic "random" bytes (a linear congruential generator), so the test never flakes. */
function noise(length: number, seed = 42): Buffer {
  const bytes = Buffer.alloc(length);
  let state = seed;
  for (let i = 0; i < length; i++) {
    state = (state * 1103515245 + 12345) % 2 ** 31;
    bytes[i] = state >> 16;
  }
  return bytes;
}

describe('readExamFile', () => {
  describe('CSV', () => {
    it('strips a byte-order mark and reads CRLF line endings', async () => {
      const table = await csv('\uFEFFaccession,room\r\nA1,MR 1\r\nA2,MR 2\r\n');
      expect(table).toEqual([['accession', 'room'], ['A1', 'MR 1'], ['A2', 'MR 2']]);
    });

    it('keeps commas, quotes and line breaks inside quoted fields', async () => {
      const table = await csv('accession,procedure,notes\nA1,"MR knee, left","Says ""hi""\nthen leaves"\n');
      expect(table[1]).toEqual(['A1', 'MR knee, left', 'Says "hi"\nthen leaves']);
    });

    it('keeps a blank line as an empty row so row numbers match the spreadsheet', async () => {
      const table = await csv('accession,room\n\nA1,MR 1\r\nA2,MR 2\rA3,MR 3\n');
      expect(table).toEqual([['accession', 'room'], [], ['A1', 'MR 1'], ['A2', 'MR 2'], ['A3', 'MR 3']]);
    });

    it('passes a ragged row through, for parseExamTable to report', async () => {
      const table = await csv('accession,room,start,duration_min,procedure\nA1,MR 1,08:00,30,MR knee, left\n');
      expect(table[1]).toEqual(['A1', 'MR 1', '08:00', '30', 'MR knee', ' left']);
      const result = parseExamTable(table, { date: DATE, timezone: 'America/Chicago', roomNames: DEMO_ROOM_NAMES });
      expect(result.errors).toEqual([{ row: 2, column: 'F', message: expect.stringContaining('no header') }]);
    });

    it('keeps formula-looking cells as text', async () => {
      const table = await csv('accession,procedure\n=1+1,@SUM(A1)\n');
      expect(table[1]).toEqual(['=1+1', '@SUM(A1)']);
    });

    it('reads the example day end to end with a BOM: the header is found, every exam valid', async () => {
      const table = await csv(exampleCsv(DATE, { bom: true }));
      const result = parseExamTable(table, { date: DATE, timezone: 'America/Chicago', roomNames: DEMO_ROOM_NAMES });
      expect(result.errors).toEqual([]);
      expect(result.rows).toHaveLength(10);
    });

    it('refuses text that is not UTF-8 (e.g. a Windows-1252 export) with 422 and the fix', async () => {
      const latin1 = Buffer.from('accession,procedure\nA1,Cr\xe2ne\n', 'latin1');
      await expect(csv(latin1)).rejects.toMatchObject({ status: 422, message: expect.stringContaining('CSV UTF-8') });
    });

    it('refuses an unclosed quote with 422 and the line', async () => {
      await expect(csv('accession,procedure\nA1,"MR knee\n')).rejects.toMatchObject({ status: 422, message: expect.stringContaining('line 2') });
    });
  });

  describe('.xlsx', () => {
    it('turns typed cells into text: time as HH:MM, numbers plain, formulas as their text, booleans as yes/no', async () => {
      const buffer = await toXlsx([
        ['accession', 'start', 'duration_min', 'procedure', 'contrast', 'notes'],
        ['A1', excelTime(8, 30), 45, { formula: '1+1' }, true, new Date(Date.UTC(2027, 2, 15, 9, 5))],
      ]);
      const table = await xlsx(buffer);
      expect(table[1]).toEqual(['A1', '08:30', '45', '=1+1', 'yes', '2027-03-15T09:05']);
    });

    it('never uses a formula cell\'s cached result', async () => {
      const workbook = new Workbook();
      const sheet = workbook.addWorksheet('Exams');
      sheet.addRow(['accession', 'duration_min']);
      sheet.addRow(['A1', { formula: '20+10', result: 30 }]);
      const table = await xlsx(Buffer.from(await workbook.xlsx.writeBuffer()));
      expect(table[1]).toEqual(['A1', '=20+10']);
    });

    it('rounds a time stored as an inexact day fraction to the minute', async () => {
      const workbook = new Workbook();
      const sheet = workbook.addWorksheet('Exams');
      sheet.addRow(['start']);
      sheet.addRow(['x']);
      // 08:30 is 0.3541666… of a day; a value 86 ms below it must still read 08:30.
      sheet.getCell('A2').value = 8.5 / 24 - 1e-6;
      sheet.getCell('A2').numFmt = 'hh:mm';
      const table = await xlsx(Buffer.from(await workbook.xlsx.writeBuffer()));
      expect(table[1]).toEqual(['08:30']);
    });

    it('joins rich text and reads only the first worksheet', async () => {
      const workbook = new Workbook();
      workbook.addWorksheet('Exams').addRows([['procedure'], [{ richText: [{ text: 'MR ' }, { text: 'knee', font: { bold: true } }] }]]);
      workbook.addWorksheet('Other').addRows([['something else'], ['x']]);
      const table = await xlsx(Buffer.from(await workbook.xlsx.writeBuffer()));
      expect(table).toEqual([['procedure'], ['MR knee']]);
    });

    it('gives the same table as the CSV of the same list', async () => {
      const fromCsv = await csv(exampleCsv(DATE, { bom: true }));
      const fromXlsx = await xlsx(await exampleXlsx(DATE));
      expect(fromXlsx).toEqual(fromCsv);
      // The typed workbook really holds time and number cells, so the equality is earned.
      const workbook = new Workbook();
      await workbook.xlsx.load((await exampleXlsx(DATE)) as never);
      expect(workbook.worksheets[0].getCell('C2').value).toBeInstanceOf(Date);
      expect(workbook.worksheets[0].getCell('D2').value).toBe(30);
      expect(fromCsv).toEqual(exampleExamTable(DATE).map((row) => (row[9] === '' ? row.slice(0, 9) : row)));
    });

    it('refuses a damaged workbook with 422 and no internals in the message', async () => {
      const good = await exampleXlsx(DATE);
      const error = await xlsx(good.subarray(0, good.length - 200)).catch((e: unknown) => e);
      expect(error).toMatchObject({ status: 422, code: 'file_refused' });
      expect((error as HttpError).message).toMatch(/^The \.xlsx file could not be opened/);
      expect((error as HttpError).message).not.toMatch(/zip|central directory|at /i);
    });

    it('refuses zip magic followed by garbage, and an .xlsx name on non-zip content, with 422', async () => {
      await expect(xlsx(Buffer.concat([Buffer.from('PK\x03\x04', 'latin1'), noise(500)]))).rejects.toMatchObject({ status: 422 });
      await expect(xlsx(Buffer.from('accession,room\nA1,MR 1\n'))).rejects.toMatchObject({ status: 422 });
    });
  });

  describe('refused files', () => {
    it('refuses random bytes with 415 (binary content is not a CSV or a workbook)', async () => {
      await expect(csv(noise(4096))).rejects.toMatchObject({ status: 415, code: 'file_refused' });
      await expect(readExamFile({ buffer: noise(4096, 7), originalname: 'upload', mimetype: 'application/octet-stream' })).rejects.toMatchObject({ status: 415 });
    });

    it('refuses an old .xls (OLE2) file with 415, even when renamed .csv', async () => {
      const ole2 = Buffer.concat([Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]), noise(512)]);
      await expect(readExamFile({ buffer: ole2, originalname: 'day.xls', mimetype: 'application/vnd.ms-excel' })).rejects.toMatchObject({ status: 415 });
      await expect(csv(ole2)).rejects.toMatchObject({ status: 415, message: expect.stringContaining('.xls') });
    });

    it('refuses other extensions such as .pdf with 415', async () => {
      await expect(readExamFile({ buffer: Buffer.from('%PDF-1.7\n'), originalname: 'day.pdf', mimetype: 'application/pdf' })).rejects.toMatchObject({
        status: 415,
        message: expect.stringContaining('".pdf" files are not accepted'),
      });
    });

    it('refuses an empty file with 422', async () => {
      await expect(csv('')).rejects.toMatchObject({ status: 422, message: 'The file is empty.' });
      await expect(csv('\uFEFF\r\n\r\n')).rejects.toMatchObject({ status: 422, message: 'The file is empty.' });
    });

    it('refuses a header-only file with 422, as CSV and as .xlsx', async () => {
      const message = 'The file has a header row but no exams.';
      await expect(csv('accession,room,start,duration_min,procedure\r\n')).rejects.toMatchObject({ status: 422, message });
      await expect(xlsx(await toXlsx([['accession', 'room', 'start', 'duration_min', 'procedure']]))).rejects.toMatchObject({ status: 422, message });
    });
  });
});

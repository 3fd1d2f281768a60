import { isUtf8 } from 'node:buffer';
import { Readable } from 'node:stream';
import { parse as parseCsv } from 'csv-parse/sync';
import { stream as excelStream, ValueType, type Cell, type Row } from 'exceljs';
import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';
import { FileLimitError } from './file-limits';
import { damagedWorkbook, unreadableFile, unsupportedFile } from './file-refusal';
import { checkWorkbookZip } from './workbook-zip';

/** An uploaded file as multer hands it over. */
export interface UploadedExamFile {
  buffer: Buffer;
  originalname: string;
  mimetype: string;
}

const ACCEPTED = 'Upload the day list as a CSV (UTF-8) or an Excel .xlsx file.';
const TEXT_EXTENSIONS = ['csv', 'txt'];
const XLSX_MIMETYPE = 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet';
const ZIP_MAGIC = Buffer.from('PK\x03\x04', 'latin1');
// Old binary Excel (.xls) and other OLE2 compound files.
const OLE2_MAGIC = Buffer.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1]);
// Excel stores times as fractions of a day counted from 1899-12-30 (or 1904-01-01 in the Mac
// date system); exceljs turns them into Dates as if that day were UTC.
const EXCEL_EPOCH_DAYS = [Date.UTC(1899, 11, 30), Date.UTC(1904, 0, 1)];
const MINUTE = 60_000;
const UTF8_BOM = Buffer.from([0xef, 0xbb, 0xbf]);

/**
 * Reads an uploaded exam list into a table of text cells (`table[0]` is the header) for
 * `parseExamTable`. The kind is decided by content first (an .xlsx is a zip), then by name.
 * Trailing empty cells are dropped from every row and blank rows are kept as `[]`, so row
 * numbers match the spreadsheet and a CSV and an .xlsx of the same list give the same table.
 *
 * @throws Refusal `file_refused` (415) for anything but CSV text or .xlsx: binary content,
 *   old .xls, other extensions.
 * @throws Refusal `file_refused` (422) for an empty or header-only file, text that is not UTF-8, a
 *   malformed CSV (unclosed quote) or a damaged workbook.
 * @throws FileLimitError (413/422) for a file over one of `EXAM_FILE_LIMITS` (rows, cells in a
 *   row, characters in a cell, unpacked workbook sizes), naming the limit. Rows are counted
 *   before a CSV is parsed and while a sheet streams, so an oversized file costs little.
 */
export async function readExamFile(file: UploadedExamFile): Promise<string[][]> {
  const { buffer } = file;
  const extension = /\.([^./\\]+)$/.exec(file.originalname)?.[1]?.toLowerCase() ?? '';
  if (extension !== '' && extension !== 'xlsx' && !TEXT_EXTENSIONS.includes(extension)) {
    throw unsupportedFile(`".${extension}" files are not accepted. ${ACCEPTED}`);
  }
  if (buffer.length === 0) throw unreadableFile('The file is empty.');
  if (startsWith(buffer, OLE2_MAGIC)) {
    throw unsupportedFile('This is an old-style Excel (.xls) file. Save it as .xlsx or CSV UTF-8 and upload again.');
  }

  let table: string[][];
  if (startsWith(buffer, ZIP_MAGIC)) table = await readXlsx(buffer);
  else if (extension === 'xlsx' || file.mimetype === XLSX_MIMETYPE) throw damagedWorkbook();
  else table = readCsv(buffer);
  checkCells(table);

  const withData = rowsWithData(table, 2);
  if (withData === 0) throw unreadableFile('The file is empty.');
  if (withData === 1) throw unreadableFile('The file has a header row but no exams.');
  return table;
}

function readCsv(buffer: Buffer): string[][] {
  if (looksBinary(buffer)) throw unsupportedFile(`The file is neither text nor an .xlsx workbook. ${ACCEPTED}`);
  if (!isUtf8(buffer)) {
    throw unreadableFile('The file is not UTF-8 text. In Excel choose "CSV UTF-8" when saving, or upload the .xlsx.');
  }
  // csv-parse reads bytes (a string would be encoded back to them), so the file goes in as it
  // came, less one byte-order mark, as decoding to text would have dropped.
  const text = startsWith(buffer, UTF8_BOM) ? buffer.subarray(UTF8_BOM.length) : buffer;
  // Lines are counted before parsing: a megabyte of blank lines parses for a minute.
  if (lineCount(text) > EXAM_FILE_LIMITS.maxRows) throw FileLimitError.rows();
  try {
    const records: string[][] = parseCsv(text, {
      bom: true,
      // A ragged row must reach parseExamTable as a row error, not end the whole read.
      relax_column_count: true,
      relax_quotes: true,
      // Files edited on several systems mix line endings; each one ends a record.
      record_delimiter: ['\r\n', '\n', '\r'],
    });
    return records.map(dropTrailingEmpty);
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    const where = line ? ` near line ${line}` : '';
    // the place goes in the import's `errors` list, so the screen shows it like a row error
    throw unreadableFile(`The CSV could not be read${where}: check for a quote that is opened but never closed.`, {
      errors: [{ row: line ?? 1, column: '', message: 'Unreadable CSV: unbalanced quotes.' }],
    });
  }
}

async function readXlsx(buffer: Buffer): Promise<string[][]> {
  await checkWorkbookZip(buffer);
  // The streaming reader sees rows one at a time, so the row limit stops a huge sheet early.
  const reader = new excelStream.xlsx.WorkbookReader(Readable.from([buffer]), {
    sharedStrings: 'cache',
    styles: 'cache',
    hyperlinks: 'cache',
    worksheets: 'emit',
    entries: 'emit',
  });
  const table: string[][] = [];
  let sawSheet = false;
  try {
    for await (const sheet of reader) {
      sawSheet = true;
      for await (const row of sheet as AsyncIterable<Row>) {
        if (row.number > EXAM_FILE_LIMITS.maxRows) throw FileLimitError.rows();
        // Blank rows are not stored in a sheet; they are kept as [] so row numbers match.
        while (table.length < row.number - 1) table.push([]);
        table.push(rowCells(row));
      }
      break; // the first sheet only
    }
  } catch (error) {
    if (error instanceof FileLimitError) throw error;
    throw damagedWorkbook();
  }
  if (!sawSheet) throw unreadableFile('The workbook has no worksheet.');
  return table;
}

// Styled empty cells count in cellCount, so the cell limit is checked on what remains (checkCells).
function rowCells(row: Row): string[] {
  const cells: string[] = [];
  for (let column = 1; column <= row.cellCount; column++) cells.push(cellText(row.getCell(column)));
  return dropTrailingEmpty(cells);
}

/** Text of a cell as the user typed it: formulas as their text, never their result. */
function cellText(cell: Cell): string {
  switch (cell.type) {
    case ValueType.Formula:
      return `=${cell.formula}`;
    case ValueType.Date:
      return dateText(cell.value as Date);
    case ValueType.Boolean:
      return cell.value ? 'yes' : 'no';
    case ValueType.Number:
      return String(cell.value);
    case ValueType.RichText:
      return (cell.value as { richText: { text: string }[] }).richText.map((run) => run.text).join('');
    case ValueType.Hyperlink:
      return String((cell.value as { text?: unknown }).text ?? '');
    case ValueType.Error:
      return String((cell.value as { error?: unknown }).error ?? '');
    case ValueType.Null:
    case ValueType.Merge: // Excel itself shows and exports a merged area's value once, in its first cell.
      return '';
    default:
      return cell.value == null ? '' : String(cell.value);
  }
}

// A time-only cell becomes HH:MM; one with a date keeps it (as YYYY-MM-DDTHH:MM) so that a
// start on another day is caught rather than silently moved onto the day being imported.
function dateText(value: Date): string {
  // Day fractions are stored in binary floating point: 08:30 can come back as 08:29:59.999.
  const rounded = new Date(Math.round(value.getTime() / MINUTE) * MINUTE);
  const [day, time] = [rounded.toISOString().slice(0, 10), rounded.toISOString().slice(11, 16)];
  const dayStart = Date.UTC(rounded.getUTCFullYear(), rounded.getUTCMonth(), rounded.getUTCDate());
  if (EXCEL_EPOCH_DAYS.includes(dayStart)) return time;
  return time === '00:00' ? day : `${day}T${time}`;
}

/** Cells per row and characters per cell, checked once the file is a table. */
function checkCells(table: string[][]): void {
  for (let i = 0; i < table.length; i++) {
    const cells = table[i];
    if (cells.length > EXAM_FILE_LIMITS.maxCellsPerRow) throw FileLimitError.cells(i + 1);
    for (let c = 0; c < cells.length; c++) {
      if (cells[c].length > EXAM_FILE_LIMITS.maxCellChars) throw FileLimitError.cellChars(i + 1, c);
    }
  }
}

/** Records a CSV can hold at most: its line breaks (CRLF counted once), plus a last unterminated line. */
function lineCount(buffer: Buffer): number {
  let lines = 0;
  for (let i = 0; i < buffer.length; i++) {
    const byte = buffer[i];
    if (byte === 0x0a) lines++;
    else if (byte === 0x0d && buffer[i + 1] !== 0x0a) lines++;
  }
  const last = buffer[buffer.length - 1];
  return last === 0x0a || last === 0x0d ? lines : lines + 1;
}

function dropTrailingEmpty(cells: string[]): string[] {
  let end = cells.length;
  while (end > 0 && cells[end - 1].trim() === '') end--;
  // Most rows have nothing to drop; reusing them spares a copy of every row of a big file.
  return end === cells.length ? cells : cells.slice(0, end);
}

// Counts only as far as needed: a big file is known to hold exams after its second filled row.
function rowsWithData(table: string[][], enough: number): number {
  let count = 0;
  for (let i = 0; i < table.length && count < enough; i++) if (table[i].length > 0) count++;
  return count;
}

function startsWith(buffer: Buffer, magic: Buffer): boolean {
  return buffer.length >= magic.length && buffer.subarray(0, magic.length).equals(magic);
}

// Text never holds NUL; a few stray control characters may come from a spreadsheet export.
function looksBinary(buffer: Buffer): boolean {
  let control = 0;
  // Indexed, not for…of: a Buffer's iterator costs ~20 ms on a 1 MB file.
  for (let i = 0; i < buffer.length; i++) {
    const byte = buffer[i];
    if (byte === 0) return true;
    if (byte < 0x20 && byte !== 0x09 && byte !== 0x0a && byte !== 0x0d && byte !== 0x0c) control++;
  }
  return control > buffer.length / 100;
}



import fc from 'fast-check';
import { DEMO_ROOM_NAMES, EXAM_LIST_HEADER, exampleCsv, excelTime, type XlsxCell } from '../../fixtures/exam-lists';
import { DAY } from './fuzz-app';

/** An upload as the fuzz sends it: bytes, the file name and the part's content type. */
export interface FuzzFile {
  bytes: Buffer;
  name: string;
  type: string;
}

const names = fc.oneof(
  { arbitrary: fc.constantFrom('day.csv', 'day.CSV', 'day.txt', 'day', 'списки.csv', 'a"b.csv', '../../day.csv', 'x'.repeat(300) + '.csv'), weight: 4 },
  { arbitrary: fc.constantFrom('day.xlsx', 'day.xls', 'day.pdf', '.csv', 'day.csv.exe'), weight: 1 },
);
const types = fc.oneof(
  { arbitrary: fc.constantFrom('text/csv', 'application/octet-stream', 'text/plain', ''), weight: 4 },
  { arbitrary: fc.constantFrom('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', 'application/pdf'), weight: 1 },
);

/** Values a day-list column holds when right. */
const validCell: Record<string, fc.Arbitrary<string>> = {
  accession: fc.nat(60).map((n) => `FZ-${n}`),
  room: fc.constantFrom(...DEMO_ROOM_NAMES, 'mr 1', ' MR 2 '),
  start: fc.tuple(fc.integer({ min: 6, max: 20 }), fc.constantFrom(0, 5, 15, 30, 45, 59)).map(([h, m]) => `${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}`),
  duration_min: fc.integer({ min: 5, max: 120 }).map(String),
  procedure: fc.oneof(fc.constantFrom('MR knee, left', 'CT head', '=SUM(1)', '"quoted"', 'MR\nmulti-line'), fc.string({ minLength: 1, maxLength: 30 })),
  coil: fc.constantFrom('', 'knee', 'head', 'body', 'spine'),
  precaution: fc.constantFrom('none', 'contact', 'droplet', 'airborne', 'enteric'),
  mobility: fc.constantFrom('ambulatory', 'wheelchair', 'stretcher'),
  contrast: fc.constantFrom('yes', 'no'),
  notes: fc.oneof(fc.constant(''), fc.string({ maxLength: 40 })),
};

/** Values a day-list column holds when wrong (or right only in an odd spelling). */
const wrongCell: Record<string, fc.Arbitrary<string>> = {
  accession: fc.oneof(fc.constant(''), fc.string({ maxLength: 12 }), fc.constant('A'.repeat(100))),
  room: fc.constantFrom('MR 9', '', 'MR  1', 'CT1'),
  start: fc.constantFrom('7:30', '25:00', '08:60', '8', `${DAY}T09:00`, `${DAY} 09:00`, '2027-03-11T09:00', '9:00 AM', '0.375', '-1:00', '23:59', '00:00', '02:30'),
  duration_min: fc.constantFrom('0', '-5', '481', '1e3', '30.5', 'NaN', '9'.repeat(30), ''),
  procedure: fc.constantFrom('', ' '),
  coil: fc.constantFrom('toaster', 'KNEE'),
  precaution: fc.constantFrom('CONTACT', 'plague', ''),
  mobility: fc.constantFrom('bed', '', 'Wheelchair'),
  contrast: fc.constantFrom('Y', 'true', '1', 'maybe', ''),
  notes: fc.nat(600).map((n) => 'n'.repeat(n)),
};

const oddCell = fc.oneof(
  fc.string({ maxLength: 20 }),
  fc.string({ unit: 'grapheme', maxLength: 10 }),
  fc.constantFrom('"', '""', '"a"b', 'a,b', '\r', '\n', '\r\n', '\uFEFF', '\u0000', ' ', '\t', ';', '=cmd|" /C calc"!A0'),
);

const REQUIRED = ['accession', 'room', 'start', 'duration_min', 'procedure'];
const OPTIONAL = EXAM_LIST_HEADER.filter((c) => !REQUIRED.includes(c));
/** The required columns and some optional ones, in any order. */
const tidyHeader = fc.shuffledSubarray(OPTIONAL).chain((optional) => fc.shuffledSubarray([...REQUIRED, ...optional], { minLength: REQUIRED.length + optional.length }));

const header = fc.oneof(
  { arbitrary: fc.constant([...EXAM_LIST_HEADER]), weight: 4 },
  { arbitrary: fc.shuffledSubarray([...EXAM_LIST_HEADER], { minLength: 1 }), weight: 2 },
  { arbitrary: fc.constant(EXAM_LIST_HEADER.map((h) => h.toUpperCase())), weight: 1 },
  { arbitrary: fc.array(fc.oneof(fc.constantFrom(...EXAM_LIST_HEADER), oddCell), { maxLength: 14 }), weight: 1 },
);

function cell(column: string, tidy: boolean): fc.Arbitrary<string> {
  const valid = validCell[column.toLowerCase()] ?? oddCell;
  if (tidy) return valid;
  return fc.oneof({ arbitrary: valid, weight: 6 }, { arbitrary: wrongCell[column.toLowerCase()] ?? oddCell, weight: 1 }, { arbitrary: oddCell, weight: 1 });
}

function row(columns: string[], tidy: boolean): fc.Arbitrary<string[]> {
  const plausible = fc.tuple(...columns.map((c) => cell(c, tidy)));
  if (tidy) return plausible;
  const ragged = fc.array(fc.oneof(oddCell, ...Object.values(validCell)), { maxLength: 14 });
  return fc.oneof({ arbitrary: plausible, weight: 8 }, { arbitrary: ragged, weight: 1 }, { arbitrary: fc.constant<string[]>([]), weight: 1 });
}

const untidyTable = header.chain((columns) => fc.array(row([...columns], false), { maxLength: 25 }).map((rows) => [[...columns], ...rows]));
const tidyTable = tidyHeader.map((columns) => [...columns]).chain((columns) =>
  fc.array(row(columns, true), { minLength: 1, maxLength: 25 }).map((rows) => {
    const at = columns.indexOf('accession');
    // a tidy list numbers its accessions, as a scheduling system would
    rows.forEach((cells, i) => (cells[at] = `FZ-${i + 1}`));
    return [columns, ...rows];
  }),
);

/**
 * A table with a (mostly) real header and rows of plausible and odd cells. A tidy one (half of
 * them) has only valid cells and unique accessions, so the fuzz reaches the commit as often as a refusal.
 */
export const examTable: fc.Arbitrary<string[][]> = fc.boolean().chain((tidy) => (tidy ? tidyTable : untidyTable));

/** CSV-ish text: quoting right, never or broken, several separators, mixed line endings, BOMs, other encodings. */
export const csvishFile: fc.Arbitrary<FuzzFile> = fc.oneof(
  fc.record({
    table: tidyTable,
    quoting: fc.constantFrom('needed', 'always'),
    separator: fc.constant(','),
    endings: fc.array(fc.constantFrom('\r\n', '\n', '\r'), { minLength: 1, maxLength: 3 }),
    bom: fc.constantFrom('', '\uFEFF'),
    encoding: fc.constant<BufferEncoding>('utf8'),
    trailing: fc.constantFrom('', '\r\n', '\n\n\n'),
    name: fc.constantFrom('day.csv', 'day.txt', 'day'),
    type: fc.constantFrom('text/csv', 'text/plain', 'application/octet-stream'),
  }),
  fc.record({
    table: untidyTable,
    quoting: fc.constantFrom('needed', 'needed', 'always', 'never', 'broken'),
    separator: fc.constantFrom(',', ',', ',', ';', '\t'),
    endings: fc.array(fc.constantFrom('\r\n', '\n', '\r'), { minLength: 1, maxLength: 4 }),
    bom: fc.constantFrom('', '', '\uFEFF', '\uFEFF\uFEFF'),
    encoding: fc.constantFrom<BufferEncoding>('utf8', 'utf8', 'utf8', 'utf8', 'latin1', 'utf16le'),
    trailing: fc.constantFrom('', '\r\n', '\n\n\n', ' '),
    name: names,
    type: types,
  }),
).map(({ table, quoting, separator, endings, bom, encoding, trailing, name, type }) => {
    const quote = (cell: string, i: number) => {
      if (quoting === 'always') return `"${cell.replaceAll('"', '""')}"`;
      if (quoting === 'never') return cell;
      if (quoting === 'broken' && i % 3 === 0) return `"${cell}`;
      return /[",;\t\r\n]/.test(cell) ? `"${cell.replaceAll('"', '""')}"` : cell;
    };
    const lines = table.map((cells, r) => cells.map(quote).join(separator) + endings[r % endings.length]);
    return { bytes: Buffer.from(bom + lines.join('') + trailing, encoding), name, type };
  });

/** An edit of a file's bytes at a relative position (0–1), so it applies to any length. */
const edit = fc.oneof(
  fc.record({ kind: fc.constant('delete' as const), at: fc.double({ min: 0, max: 1, noNaN: true }), length: fc.nat(40) }),
  fc.record({ kind: fc.constant('insert' as const), at: fc.double({ min: 0, max: 1, noNaN: true }), text: fc.oneof(oddCell, fc.constantFrom(',', '"', '\r\n', '\r', '\n', '\uFEFF', ',,,,,,,,', '\u00e9', '\xff')) }),
  fc.record({ kind: fc.constant('flip' as const), at: fc.double({ min: 0, max: 1, noNaN: true }), bit: fc.nat(7) }),
  fc.record({ kind: fc.constant('overwrite' as const), at: fc.double({ min: 0, max: 1, noNaN: true }), bytes: fc.uint8Array({ minLength: 1, maxLength: 32 }) }),
  fc.record({ kind: fc.constant('truncate' as const), at: fc.double({ min: 0, max: 1, noNaN: true }) }),
  fc.record({ kind: fc.constant('duplicate' as const), at: fc.double({ min: 0, max: 1, noNaN: true }), length: fc.nat(200) }),
);
export type Edit = typeof edit extends fc.Arbitrary<infer T> ? T : never;
export const edits = fc.array(edit, { minLength: 1, maxLength: 4 });

/** Applies edits in order; `latin1` keeps inserted text one byte per character, as a broken encoder would. */
export function applyEdits(bytes: Buffer, list: Edit[]): Buffer {
  let out = Buffer.from(bytes);
  for (const e of list) {
    const at = Math.min(out.length, Math.floor(e.at * out.length));
    switch (e.kind) {
      case 'delete':
        out = Buffer.concat([out.subarray(0, at), out.subarray(at + e.length)]);
        break;
      case 'insert':
        out = Buffer.concat([out.subarray(0, at), Buffer.from(e.text, e.text === '\xff' ? 'latin1' : 'utf8'), out.subarray(at)]);
        break;
      case 'flip':
        if (at < out.length) out[at] = out[at]! ^ (1 << e.bit);
        break;
      case 'overwrite':
        Buffer.from(e.bytes).copy(out, at);
        break;
      case 'truncate':
        out = out.subarray(0, at);
        break;
      case 'duplicate':
        out = Buffer.concat([out.subarray(0, at + e.length), out.subarray(at)]);
        break;
    }
  }
  return out;
}

/** The good day list, edited: a byte here, a line there, a quote, a BOM, a cut. */
export const editedCsv: fc.Arbitrary<FuzzFile> = fc
  .record({ bom: fc.boolean(), lineEnding: fc.constantFrom<'\r\n' | '\n'>('\r\n', '\n'), edits, name: names, type: types })
  .map(({ bom, lineEnding, edits: list, name, type }) => ({ bytes: applyEdits(Buffer.from(exampleCsv(DAY, { bom, lineEnding })), list), name, type }));

/** Random bytes under any name. */
export const randomBytesFile: fc.Arbitrary<FuzzFile> = fc
  .record({ bytes: fc.uint8Array({ maxLength: 4096 }), prefix: fc.constantFrom('', 'PK\x03\x04', '\xd0\xcf\x11\xe0\xa1\xb1\x1a\xe1', 'accession,room\r\n'), name: names, type: types })
  .map(({ bytes, prefix, name, type }) => ({ bytes: Buffer.concat([Buffer.from(prefix, 'latin1'), Buffer.from(bytes)]), name, type }));

/** A good workbook, cut short, bit-flipped or overwritten. */
export function editedWorkbook(workbook: Buffer): fc.Arbitrary<FuzzFile> {
  return fc
    .record({ edits, name: fc.constantFrom('day.xlsx', 'day.csv', 'day'), type: types })
    .map(({ edits: list, name, type }) => ({ bytes: applyEdits(workbook, list), name, type }));
}

/** A table for a workbook: text cells, some turned into numbers, dates, booleans, formulas or blanks. */
export const workbookTable: fc.Arbitrary<XlsxCell[][]> = fc
  .tuple(examTable, fc.array(fc.tuple(fc.nat(30), fc.nat(12), fc.oneof(
    fc.double({ noNaN: true, noDefaultInfinity: true }),
    fc.integer({ min: -10, max: 600 }),
    fc.date({ min: new Date(Date.UTC(1899, 11, 30)), max: new Date(Date.UTC(2100, 0, 1)), noInvalidDate: true }),
    fc.constantFrom<XlsxCell>(true, false, null, { formula: 'A1+1' }, { formula: 'NOW()' }, excelTime(8, 30), excelTime(23, 59)),
  )), { maxLength: 8 }))
  .map(([table, typed]) => {
    const cells: XlsxCell[][] = table.map((r) => [...r]);
    for (const [r, c, value] of typed) if (cells[r]) cells[r]![c] = value;
    return cells;
  });

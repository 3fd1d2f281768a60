import { DEMO_ROOM_NAMES, EXAM_LIST_HEADER, exampleExamTable } from '../../tests/fixtures/exam-lists';
import { EXAM_LIST_COLUMNS } from './columns';
import { parseExamTable } from './parse-rows';

const DATE = '2027-03-15';
const OPTIONS = { date: DATE, timezone: 'America/Chicago', roomNames: DEMO_ROOM_NAMES };
const HEADER = ['accession', 'room', 'start', 'duration_min', 'procedure'];

/** A table with the five required columns and the given data rows. */
function table(...rows: string[][]): string[][] {
  return [HEADER, ...rows];
}

function errorsOf(rows: string[][], options = OPTIONS) {
  return parseExamTable(table(...rows), options).errors;
}

describe('parseExamTable', () => {
  it('returns every exam of a valid day list, typed and with defaults', () => {
    const result = parseExamTable(exampleExamTable(DATE), OPTIONS);
    expect(result.errors).toEqual([]);
    expect(result.warnings).toEqual([]);
    expect(result.rows).toHaveLength(10);
    expect(result.rows[1]).toEqual({
      row: 3,
      accession: 'TW-20270315-002',
      room: 'MR 1',
      start: '2027-03-15T08:05:00-05:00',
      durationMinutes: 45,
      procedure: 'MR brain with contrast',
      coil: 'head',
      precaution: 'none',
      mobility: 'wheelchair',
      contrast: true,
      notes: null,
    });
    expect(result.rows.map((row) => row.precaution)).toEqual(expect.arrayContaining(['none', 'contact', 'enteric', 'droplet', 'airborne']));
  });

  it('fills optional columns the file leaves out with their defaults', () => {
    const [row] = parseExamTable(table(['A1', 'CT 1', '09:00', '15', 'CT head']), OPTIONS).rows;
    expect(row).toMatchObject({ coil: null, precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null });
  });

  it('reads headers in any order and case, and stores the canonical room name', () => {
    const result = parseExamTable(
      [
        ['PROCEDURE', 'Duration_Min', ' Start ', 'Room', 'Accession', 'Precaution', 'Mobility', 'Contrast'],
        ['MR knee', '30', '7:30', 'mr 2', 'A1', 'CONTACT', 'Wheelchair', 'Yes'],
      ],
      OPTIONS,
    );
    expect(result.errors).toEqual([]);
    expect(result.rows[0]).toMatchObject({ accession: 'A1', room: 'MR 2', start: '2027-03-15T07:30:00-05:00', precaution: 'contact', mobility: 'wheelchair', contrast: true });
  });

  it('handles a byte-order mark left on the first header cell', () => {
    const result = parseExamTable([['\uFEFFaccession', ...HEADER.slice(1)], ['A1', 'MR 1', '08:00', '30', 'MR knee']], OPTIONS);
    expect(result.errors).toEqual([]);
    expect(result.rows[0].accession).toBe('A1');
  });

  it('trims cells and skips blank rows while keeping spreadsheet row numbers', () => {
    const result = parseExamTable(table(['  A1 ', ' MR 1', '08:00 ', ' 30', ' MR knee  '], [], ['', '  ', ''], ['A2', 'MR 1', '09:00', '30', 'MR hip']), OPTIONS);
    expect(result.errors).toEqual([]);
    expect(result.rows.map((row) => [row.row, row.accession, row.procedure])).toEqual([
      [2, 'A1', 'MR knee'],
      [5, 'A2', 'MR hip'],
    ]);
  });

  it('accepts each documented contrast spelling, case-insensitively', () => {
    const spellings = ['yes', 'Y', 'TRUE', '1', 'no', 'n', 'False', '0', ''];
    const rows = spellings.map((contrast, i) => [`A${i}`, 'MR 1', `0${i}:00`, '30', 'MR knee', contrast]);
    const result = parseExamTable([[...HEADER, 'contrast'], ...rows], OPTIONS);
    expect(result.rows.map((row) => row.contrast)).toEqual([true, true, true, true, false, false, false, false, false]);
  });

  it('keeps formula-looking text verbatim in text columns, never evaluated', () => {
    const result = parseExamTable(
      [
        [...HEADER, 'notes'],
        ['=1+1', 'MR 1', '08:00', '30', '+SUM(A1:A3)', '@cmd'],
        ['-A2', 'MR 1', '09:00', '30', '=HYPERLINK("x")', '-2+3'],
      ],
      OPTIONS,
    );
    expect(result.errors).toEqual([]);
    expect(result.rows.map(({ accession, procedure, notes }) => [accession, procedure, notes])).toEqual([
      ['=1+1', '+SUM(A1:A3)', '@cmd'],
      ['-A2', '=HYPERLINK("x")', '-2+3'],
    ]);
  });

  it('takes the first occurrence of a repeated fall-back time and warns on that row (America/Chicago, 2027-11-07)', () => {
    const result = parseExamTable(table(['A1', 'MR 1', '01:30', '30', 'MR knee']), { ...OPTIONS, date: '2027-11-07' });
    expect(result.errors).toEqual([]);
    // First occurrence = daylight time, CDT = UTC-05:00.
    expect(result.rows[0].start).toBe('2027-11-07T01:30:00-05:00');
    expect(result.warnings).toEqual([{ row: 2, column: 'start', message: expect.stringContaining('the first one was taken (UTC-05:00)') }]);
  });

  it('warns about an unknown column and still reads the file', () => {
    const result = parseExamTable([[...HEADER, 'referrer'], ['A1', 'MR 1', '08:00', '30', 'MR knee', 'ignored']], OPTIONS);
    expect(result.errors).toEqual([]);
    expect(result.rows).toHaveLength(1);
    expect(result.warnings).toEqual([{ row: 1, column: 'referrer', message: 'Column "referrer" is not part of the exam list and was ignored.' }]);
  });

  describe('bad values', () => {
    const cases: [string, string[], string, string | RegExp][] = [
      ['an empty accession', ['', 'MR 1', '08:00', '30', 'MR knee'], 'accession', 'accession is required.'],
      ['an unknown room', ['A1', 'MR 9', '08:00', '30', 'MR knee'], 'room', 'Room "MR 9" is not set up. Known rooms: CT 1, MR 1, MR 2, MR 3.'],
      ['25:00', ['A1', 'MR 1', '25:00', '30', 'MR knee'], 'start', /^25:00 is not a time of day/],
      ['12:60', ['A1', 'MR 1', '12:60', '30', 'MR knee'], 'start', /^12:60 is not a time of day/],
      ['garbage start', ['A1', 'MR 1', 'soon', '30', 'MR knee'], 'start', /^"soon" is not a start time/],
      ['ISO start on another day', ['A1', 'MR 1', '2027-03-16T08:00:00-05:00', '30', 'MR knee'], 'start', /not on 2027-03-15/],
      ['duration 4', ['A1', 'MR 1', '08:00', '4', 'MR knee'], 'duration_min', 'duration_min must be whole minutes from 5 to 480; got "4".'],
      ['duration 481', ['A1', 'MR 1', '08:00', '481', 'MR knee'], 'duration_min', /got "481"/],
      ['duration 30.5', ['A1', 'MR 1', '08:00', '30.5', 'MR knee'], 'duration_min', /got "30.5"/],
      ['duration =1+1', ['A1', 'MR 1', '08:00', '=1+1', 'MR knee'], 'duration_min', /got "=1\+1"/],
      ['duration -30', ['A1', 'MR 1', '08:00', '-30', 'MR knee'], 'duration_min', /got "-30"/],
      ['an empty procedure', ['A1', 'MR 1', '08:00', '30', ''], 'procedure', 'procedure is required.'],
      ['a 201-character procedure', ['A1', 'MR 1', '08:00', '30', 'p'.repeat(201)], 'procedure', 'procedure is 201 characters long; the limit is 200.'],
      ['a 65-character accession', ['A'.repeat(65), 'MR 1', '08:00', '30', 'MR knee'], 'accession', 'accession is 65 characters long; the limit is 64.'],
    ];

    it.each(cases)('refuses %s with row and column', (_label, row, column, message) => {
      const result = parseExamTable(table(row), OPTIONS);
      expect(result.errors).toEqual([{ row: 2, column, message: typeof message === 'string' ? message : expect.stringMatching(message) }]);
      expect(result.rows).toEqual([]);
    });

    it('refuses a start that the spring-forward change skips (America/Chicago, 2027-03-14)', () => {
      expect(errorsOf([['A1', 'MR 1', '02:30', '30', 'MR knee']], { ...OPTIONS, date: '2027-03-14' })).toEqual([
        { row: 2, column: 'start', message: '02:30 does not exist on 2027-03-14 in America/Chicago: clocks skip from 02:00 to 03:00' },
      ]);
    });

    it.each([
      ['precaution', 'isolation', 'precaution must be one of none, contact, enteric, droplet, airborne; got "isolation".'],
      ['mobility', 'walking', 'mobility must be one of ambulatory, wheelchair, stretcher; got "walking".'],
      ['contrast', 'maybe', 'contrast must be yes or no; got "maybe".'],
    ])('refuses a bad %s value', (column, value, message) => {
      const result = parseExamTable([[...HEADER, column], ['A1', 'MR 1', '08:00', '30', 'MR knee', value]], OPTIONS);
      expect(result.errors).toEqual([{ row: 2, column, message }]);
    });

    it('accepts notes of 500 characters and refuses 501', () => {
      const notes = (length: number) => parseExamTable([[...HEADER, 'notes'], ['A1', 'MR 1', '08:00', '30', 'MR knee', 'n'.repeat(length)]], OPTIONS);
      expect(notes(500).errors).toEqual([]);
      expect(notes(501).errors).toEqual([{ row: 2, column: 'notes', message: 'notes is 501 characters long; the limit is 500.' }]);
    });

    it('refuses the second occurrence of an accession, naming the first row', () => {
      expect(errorsOf([['A1', 'MR 1', '08:00', '30', 'MR knee'], ['A2', 'MR 1', '09:00', '30', 'MR knee'], ['A1', 'MR 2', '08:00', '30', 'MR hip']])).toEqual([
        { row: 4, column: 'accession', message: 'Accession "A1" is already used on row 2.' },
      ]);
    });

    it('refuses data in a column without a header (a ragged CSV row)', () => {
      expect(errorsOf([['A1', 'MR 1', '08:00', '30', 'MR knee', ' left']])).toEqual([
        { row: 2, column: 'F', message: 'Cell F2 holds "left" but its column has no header; a comma inside a value needs "quotes".' },
      ]);
    });
  });

  describe('whole-file problems', () => {
    it('reports a missing required column once on row 1, not on every row, and keeps checking the others', () => {
      const result = parseExamTable(
        [
          ['accession', 'room', 'start', 'procedure'],
          ['A1', 'MR 1', '08:00', 'MR knee'],
          ['A2', 'MR 7', '08:30', 'MR hip'],
        ],
        OPTIONS,
      );
      expect(result.errors).toEqual([
        { row: 1, column: 'duration_min', message: 'Required column duration_min is missing.' },
        { row: 3, column: 'room', message: expect.stringContaining('Room "MR 7" is not set up') },
      ]);
      expect(result.rows).toEqual([]);
    });

    it('refuses a wrong header name as a missing column plus an ignored one', () => {
      const result = parseExamTable([['accession', 'room', 'time', 'duration_min', 'procedure'], ['A1', 'MR 1', '08:00', '30', 'MR knee']], OPTIONS);
      expect(result.errors).toEqual([{ row: 1, column: 'start', message: 'Required column start is missing.' }]);
      expect(result.warnings).toEqual([{ row: 1, column: 'time', message: expect.stringContaining('"time"') }]);
    });

    it('refuses an empty table and a header without exams', () => {
      expect(parseExamTable([], OPTIONS).errors).toEqual([{ row: 1, column: '', message: expect.stringContaining('header') }]);
      expect(parseExamTable([HEADER, ['', '']], OPTIONS).errors).toEqual([{ row: 1, column: '', message: 'The file has a header but no exams.' }]);
    });

    it('lists every error of every row, in row then column order', () => {
      const result = parseExamTable(
        [
          [...HEADER, 'precaution', 'notes'],
          ['A1', 'MR 1', '08:00', '30', 'MR knee', 'none', ''],
          ['A2', 'MR 9', '25:00', '4', '', 'sick', 'n'.repeat(501)],
          ['A1', 'MR 1', '12:60', '30.5', 'MR hip', '', ''],
          ['A4', 'CT 1', '09:00', '15', 'CT head', '', ''],
        ],
        OPTIONS,
      );
      expect(result.errors.map(({ row, column }) => [row, column])).toEqual([
        [3, 'room'],
        [3, 'start'],
        [3, 'duration_min'],
        [3, 'procedure'],
        [3, 'precaution'],
        [3, 'notes'],
        [4, 'accession'],
        [4, 'start'],
        [4, 'duration_min'],
      ]);
      // The valid rows are still returned for the preview; the file as a whole is refused.
      expect(result.rows.map((row) => row.accession)).toEqual(['A1', 'A4']);
    });

    it('keeps the fixtures in step with the column definitions', () => {
      expect(EXAM_LIST_HEADER).toEqual(EXAM_LIST_COLUMNS.map((column) => column.name));
    });
  });

  describe('invalid options', () => {
    it('throws RangeError for a date that is not a day', () => {
      expect(() => parseExamTable(table(), { ...OPTIONS, date: '2027-02-30' })).toThrow(RangeError);
      expect(() => parseExamTable(table(), { ...OPTIONS, date: '15/03/2027' })).toThrow(RangeError);
    });

    it('throws RangeError for an unknown zone', () => {
      expect(() => parseExamTable(table(), { ...OPTIONS, timezone: 'Mars/Olympus' })).toThrow(RangeError);
    });

    it('says so when no rooms are set up', () => {
      expect(errorsOf([['A1', 'MR 1', '08:00', '30', 'MR knee']], { ...OPTIONS, roomNames: [] })[0].message).toBe('Room "MR 1" is not set up. No rooms are set up yet.');
    });
  });
});

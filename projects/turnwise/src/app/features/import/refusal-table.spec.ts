import { markRefusedTable } from './refusal-table';

// An invented file: header, then two exams; row 3 has a bad duration and a stray cell in column G.
const table = [
  ['Accession', 'Room', 'Start', 'Duration Min', 'Procedure', ''],
  ['ACC-1', 'MR 1', '08:00', '30', 'MR knee'],
  ['ACC-2', 'MR 1', '08:40', '4', 'MR spine', '', 'stray'],
];

describe('markRefusedTable', () => {
  it('pins a cell problem to the column its header names, matched like the parser matches headers', () => {
    const marked = markRefusedTable(table, [{ row: 3, column: 'duration_min', message: 'duration_min must be 5 to 480.' }]);
    expect(marked.rows[1].row).toBe(3);
    expect(marked.rows[1].cells[3]).toEqual({ text: '4', problems: ['duration_min must be 5 to 480.'] });
    expect(marked.rows[0].cells.every((cell) => cell.problems.length === 0)).toBe(true);
  });

  it('pins a problem in a column with no header by its spreadsheet letter', () => {
    const marked = markRefusedTable(table, [{ row: 3, column: 'G', message: 'Cell G3 has no header.' }]);
    expect(marked.rows[1].cells[6].problems).toEqual(['Cell G3 has no header.']);
  });

  it('pads short rows to the widest so every row has a cell per column', () => {
    const marked = markRefusedTable(table, []);
    expect(marked.width).toBe(7);
    expect(marked.rows[0].cells).toHaveLength(7);
    expect(marked.header?.cells[0].text).toBe('Accession');
  });

  it('keeps whole-row problems and missing columns on the row, and skips rows past the table', () => {
    const marked = markRefusedTable(table, [
      { row: 1, column: 'coil', message: 'Required column coil is missing.' },
      { row: 2, column: '', message: 'Row is empty.' },
      { row: 5000, column: 'room', message: 'Past the preview.' },
    ]);
    expect(marked.header?.problems).toEqual(['Required column coil is missing.']);
    expect(marked.rows[0].problems).toEqual(['Row is empty.']);
  });
});

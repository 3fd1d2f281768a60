import { findColumn, normaliseHeader } from './columns';
import { columnLetter, readHeader } from './header';

const REQUIRED = ['accession', 'room', 'start', 'duration_min', 'procedure'];

describe('normaliseHeader', () => {
  it('trims, lower-cases and drops a byte-order mark', () => {
    expect(normaliseHeader('\uFEFF  Accession ')).toBe('accession');
  });

  it('treats spaces and hyphens as underscores', () => {
    expect(normaliseHeader('Duration Min')).toBe('duration_min');
    expect(normaliseHeader('duration-min')).toBe('duration_min');
  });
});

describe('findColumn', () => {
  it('returns the definition with its required flag', () => {
    expect(findColumn('PROCEDURE')).toMatchObject({ name: 'procedure', required: true });
    expect(findColumn('notes')).toMatchObject({ name: 'notes', required: false });
  });

  it('returns undefined for a column that is not ours', () => {
    expect(findColumn('patient_name')).toBeUndefined();
  });
});

describe('readHeader', () => {
  it('finds columns in any order and case', () => {
    const header = readHeader(['Procedure', 'START', 'room', 'Duration_Min', 'ACCESSION', 'Notes']);
    expect(header.positions).toEqual({ procedure: 0, start: 1, room: 2, duration_min: 3, accession: 4, notes: 5 });
    expect(header.errors).toEqual([]);
    expect(header.missing).toEqual([]);
  });

  it('warns about an unknown column and ignores it', () => {
    const header = readHeader([...REQUIRED, 'Ward']);
    expect(header.warnings).toEqual([{ row: 1, column: 'Ward', message: 'Column "Ward" is not part of the exam list and was ignored.' }]);
    expect(header.errors).toEqual([]);
  });

  it('reports each missing required column once, on row 1, by name', () => {
    const header = readHeader(['accession', 'room', 'begin', 'duration_min']);
    expect(header.errors).toEqual([
      { row: 1, column: 'start', message: 'Required column start is missing.' },
      { row: 1, column: 'procedure', message: 'Required column procedure is missing.' },
    ]);
    expect(header.missing).toEqual(['start', 'procedure']);
  });

  it('refuses a column given twice', () => {
    const header = readHeader([...REQUIRED, 'Room']);
    expect(header.errors).toEqual([{ row: 1, column: 'room', message: 'Column room appears twice (columns B and F); keep one.' }]);
  });

  it('hints at a semicolon-separated file', () => {
    const header = readHeader(['accession;room;start;duration_min;procedure']);
    expect(header.errors[0].message).toBe('Required column accession is missing. The header looks separated by ";"; the file uses commas.');
  });
});

describe('columnLetter', () => {
  it.each([
    [0, 'A'],
    [25, 'Z'],
    [26, 'AA'],
    [27, 'AB'],
    [701, 'ZZ'],
    [702, 'AAA'],
  ])('names index %i as %s', (index, letter) => {
    expect(columnLetter(index)).toBe(letter);
  });
});

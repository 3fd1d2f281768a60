import { parseExamTable } from '@shared/exam-list';
import type { DayPlanInput } from '@shared/turnover';

import { dayListCsv, templateCsv } from './day-list-file';
import { DEMO_SETUP } from '@shared/turnover/demo-protocols';

// Invented day, America/Chicago (CDT, -05:00).
const day: DayPlanInput = {
  date: '2027-03-15',
  timezone: 'America/Chicago',
  ...DEMO_SETUP,
  rooms: [
    { id: 1, name: 'MR 1', modality: 'MR', airChangesPerHour: 6, staff: 1, opensAt: '07:00', closesAt: '19:00' },
    { id: 2, name: 'CT 1', modality: 'CT', airChangesPerHour: 12, staff: 1, opensAt: '07:00', closesAt: '19:00' },
  ],
  exams: [
    { id: 2, accession: 'ACC-2', roomId: 1, start: '2027-03-15T09:05:00-05:00', durationMinutes: 45, procedure: 'MR brain, with contrast', coil: 'head', precaution: 'airborne', mobility: 'stretcher', contrast: true, notes: 'says "hi"', version: 3 },
    { id: 1, accession: 'ACC-1', roomId: 1, start: '2027-03-15T08:00:00-05:00', durationMinutes: 30, procedure: 'MR knee', coil: null, precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1 },
    { id: 9, accession: 'ACC-9', roomId: 2, start: '2027-03-15T07:30:00-05:00', durationMinutes: 15, procedure: 'CT chest', coil: null, precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1 },
  ],
};

/** Reads CSV as the server does for these simple cells (quotes, commas and doubled quotes). */
function readCsv(csv: string): string[][] {
  return csv
    .trimEnd()
    .split('\r\n')
    .map((line) => [...line.matchAll(/("([^"]|"")*"|[^,]*)(,|$)/g)].filter((m) => m.index! < line.length || m[1] !== '').map((m) => (m[1].startsWith('"') ? m[1].slice(1, -1).replace(/""/g, '"') : m[1])));
}

describe('dayListCsv', () => {
  it('writes the day in the import format, which the import reads back to the same exams', () => {
    const csv = dayListCsv(day);
    expect(csv.split('\r\n')[0]).toBe('accession,room,start,duration_min,procedure,coil,precaution,mobility,contrast,notes');
    const parsed = parseExamTable(readCsv(csv), { date: day.date, timezone: day.timezone, roomNames: ['MR 1', 'CT 1'] });
    expect(parsed.errors).toEqual([]);
    expect(parsed.rows.map(({ row: _row, ...exam }) => exam)).toEqual([
      { accession: 'ACC-1', room: 'MR 1', start: '2027-03-15T08:00:00-05:00', durationMinutes: 30, procedure: 'MR knee', coil: null, precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null },
      { accession: 'ACC-2', room: 'MR 1', start: '2027-03-15T09:05:00-05:00', durationMinutes: 45, procedure: 'MR brain, with contrast', coil: 'head', precaution: 'airborne', mobility: 'stretcher', contrast: true, notes: 'says "hi"' },
      { accession: 'ACC-9', room: 'CT 1', start: '2027-03-15T07:30:00-05:00', durationMinutes: 15, procedure: 'CT chest', coil: null, precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null },
    ]);
  });
});

describe('templateCsv', () => {
  it('is the header row alone', () => {
    expect(templateCsv()).toBe('accession,room,start,duration_min,procedure,coil,precaution,mobility,contrast,notes\r\n');
  });
});

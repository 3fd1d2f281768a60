import { parseRosterTable } from './roster-file';

const ROOMS = [{ id: 1, name: 'MR 1' }, { id: 2, name: 'MR 2' }, { id: 4, name: 'CT 1' }];
const HEADER = ['Name', 'Role', 'Count', 'Start', 'End', 'Breaks', 'Rooms'];

describe('parseRosterTable', () => {
  it('returns the rows of a good file: names, counts, breaks and rooms (invented example)', () => {
    const result = parseRosterTable(
      [
        HEADER,
        ['Sam Example', 'Technologist', '', '07:00', '15:30', '11:00-11:30', 'MR 1'],
        ['', 'aide', '3', '7:00', '15:00', '10:00–10:15; 12:30-13:00', 'mr 1 + MR 2'],
        [],
        ['', 'aide', '', '12:00', '20:00', '', 'CT 1;MR 2'],
      ],
      ROOMS,
    );
    expect(result).toEqual({
      rows: [
        { name: 'Sam Example', role: 'technologist', count: 1, start: '07:00', end: '15:30', breaks: [{ start: '11:00', end: '11:30' }], roomIds: [1] },
        { name: null, role: 'aide', count: 3, start: '07:00', end: '15:00', breaks: [{ start: '10:00', end: '10:15' }, { start: '12:30', end: '13:00' }], roomIds: [1, 2] },
        { name: null, role: 'aide', count: 1, start: '12:00', end: '20:00', breaks: [], roomIds: [4, 2] },
      ],
    });
  });

  it('refuses the whole file with every problem by row and column', () => {
    const result = parseRosterTable(
      [
        HEADER,
        ['Sam Example', 'porter', '', '07:00', '15:30', '', 'MR 1'],
        ['', 'aide', '2', '15:00', '07:00', '', 'MR 9'],
        ['', 'aide', 'two', '07:00', '15:00', 'lunch', 'MR 1'],
        ['', 'aide', '1', '07:00', '15:00', '06:00-06:30', 'MR 1'],
        ['Ari Sol', 'aide', '', '07:00', '15:00', '', 'MR 2'],
        ['ari sol', 'aide', '', '07:00', '15:00', '', 'MR 2'],
      ],
      ROOMS,
    );
    expect(result.errors).toEqual([
      { row: 2, column: 'role', message: 'a role is technologist or aide' },
      { row: 3, column: 'rooms', message: 'no room "MR 9" is set up (or it is retired)' },
      { row: 3, column: 'end', message: 'the shift must end after it starts' },
      { row: 4, column: 'breaks', message: '"lunch" is not a break: use HH:MM-HH:MM, several separated by ;' },
      { row: 4, column: 'count', message: expect.any(String) },
      { row: 5, column: 'breaks', message: 'the break is outside the shift (07:00–15:00)' },
      { row: 7, column: 'name', message: '"ari sol" is already on the roster (row 6)' },
    ]);
  });

  it('refuses a header without the required columns, or with an unknown one', () => {
    expect(parseRosterTable([['name', 'start', 'shoe size']], ROOMS).errors).toEqual([
      { row: 1, column: 'shoe size', message: 'unknown column (use name, role, count, start, end, breaks, rooms)' },
      { row: 1, column: 'role', message: 'a required column is missing' },
      { row: 1, column: 'end', message: 'a required column is missing' },
      { row: 1, column: 'rooms', message: 'a required column is missing' },
    ]);
  });
});

import type { RosterRow } from '../api/roster';
import { expandRoster } from './expand';

const shift = { start: '07:00', end: '15:00', breaks: [{ start: '11:00', end: '11:30' }], roomIds: [1, 2] };

describe('expandRoster', () => {
  it('returns a named row as one person and a counted row as that many, numbered per role across rows', () => {
    const rows: RosterRow[] = [
      { name: 'Sam Okafor', role: 'technologist', count: 1, ...shift },
      { name: null, role: 'aide', count: 2, ...shift },
      { name: null, role: 'technologist', count: 1, ...shift },
      { name: null, role: 'aide', count: 1, ...shift, roomIds: [3] },
    ];
    expect(expandRoster(rows).map((p) => [p.id, p.label, p.name])).toEqual([
      ['r1', 'Sam Okafor', 'Sam Okafor'],
      ['r2-1', 'Aide 1', null],
      ['r2-2', 'Aide 2', null],
      ['r3-1', 'Technologist 1', null],
      ['r4-1', 'Aide 3', null],
    ]);
    expect(expandRoster(rows)[4]!.roomIds).toEqual([3]);
  });

  it('returns copies: changing a person leaves the rows as they were', () => {
    const rows: RosterRow[] = [{ name: null, role: 'aide', count: 2, ...shift }];
    const [first] = expandRoster(rows);
    first!.breaks.push({ start: '13:00', end: '13:10' });
    first!.roomIds.push(9);
    expect(rows[0]!.breaks).toHaveLength(1);
    expect(rows[0]!.roomIds).toEqual([1, 2]);
  });

  it('returns nobody for no rows', () => {
    expect(expandRoster([])).toEqual([]);
  });
});

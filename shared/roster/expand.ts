import { ROSTER_ROLE_LABEL, type RosterPerson, type RosterRow } from '../api/roster';

/**
 * The people a roster's rows stand for, in row order: a named row is one person, a counted row
 * that many anonymous people, numbered per role across the day ("Aide 1", "Aide 2", …) so two
 * counted rows of aides never both have an "Aide 1". Ids are stable for the same rows:
 * `r<row>` for a named person, `r<row>-<n>` for the n-th person of a count (both 1-based).
 *
 * @example
 * expandRoster([{ name: null, role: 'aide', count: 2, start: '07:00', end: '15:00', breaks: [], roomIds: [1, 2] }])
 *   .map((p) => [p.id, p.label]); // [['r1-1', 'Aide 1'], ['r1-2', 'Aide 2']]
 */
export function expandRoster(rows: readonly RosterRow[]): RosterPerson[] {
  const numbered: Record<string, number> = {};
  const people: RosterPerson[] = [];
  rows.forEach((row, r) => {
    const shift = { role: row.role, start: row.start, end: row.end, breaks: row.breaks.map((b) => ({ ...b })), roomIds: [...row.roomIds] };
    if (row.name !== null) {
      people.push({ id: `r${r + 1}`, name: row.name, label: row.name, ...shift });
      return;
    }
    for (let n = 1; n <= row.count; n++) {
      const number = (numbered[row.role] = (numbered[row.role] ?? 0) + 1);
      people.push({ id: `r${r + 1}-${n}`, name: null, label: `${ROSTER_ROLE_LABEL[row.role]} ${number}`, ...shift });
    }
  });
  return people;
}

import { spareHelpers } from './roster-helpers';

describe('spareHelpers', () => {
  // Invented example: Aide 1 on shift 07:00–15:00 with a break 11:00–11:30, working the turnovers
  // 08:00–08:14 in MR 1 and 08:20–08:30 in MR 2; 3 minutes' walk.
  const people = {
    source: 'day' as const,
    walkingMinutes: 3,
    uncoveredRoomIds: [],
    provenOptimal: true,
    people: [
      {
        id: 'r1-1', label: 'Aide 1', name: null, role: 'aide' as const,
        start: '2027-03-16T07:00:00-05:00', end: '2027-03-16T15:00:00-05:00',
        breaks: [{ start: '2027-03-16T11:00:00-05:00', end: '2027-03-16T11:30:00-05:00' }],
        roomIds: [1, 2],
        work: [
          { roomId: 1, toExamId: 2, start: '2027-03-16T08:00:00-05:00', end: '2027-03-16T08:14:00-05:00' },
          { roomId: 2, toExamId: 5, start: '2027-03-16T08:20:00-05:00', end: '2027-03-16T08:30:00-05:00' },
        ],
      },
    ],
  };

  it('returns the shift less breaks and work (with walking), in stretches of 10 minutes or more', () => {
    expect(spareHelpers(people)).toEqual([
      { id: 'r1-1', label: 'Aide 1', roomIds: [1, 2], free: [{ start: '07:00', end: '07:57' }, { start: '08:33', end: '11:00' }, { start: '11:30', end: '15:00' }] },
    ]);
  });

  it('returns no free time for a person busy all shift', () => {
    const busy = { ...people, people: [{ ...people.people[0]!, work: [{ roomId: 1, toExamId: 2, start: '2027-03-16T07:00:00-05:00', end: '2027-03-16T15:00:00-05:00' }] }] };
    expect(spareHelpers(busy)[0]!.free).toEqual([]);
  });
});

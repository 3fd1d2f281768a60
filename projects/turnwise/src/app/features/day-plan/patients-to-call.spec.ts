import { callLine, callsCsv, movedExams, withMoves } from './patients-to-call';
import { DAY_INPUT, dayPlan } from './testing/example-day';

const moved = (changes: Record<number, { roomId?: number; start: string }>) =>
  dayPlan({
    ...DAY_INPUT,
    exams: DAY_INPUT.exams.map((e) =>
      changes[e.id] ? { ...e, roomId: changes[e.id].roomId ?? e.roomId, start: `2027-03-15T${changes[e.id].start}:00-05:00` } : e,
    ),
  });

describe('movedExams', () => {
  it('lists each exam whose start changed, old → new, and none that stayed', () => {
    const calls = movedExams(dayPlan(), moved({ 2: { start: '08:55' }, 3: { start: '09:55' } }));
    expect(calls.map(callLine)).toEqual(['ACC-2: MR 1 08:45 → 08:55', 'ACC-3: MR 1 09:45 → 09:55']);
  });

  it('names the new room when the slot changed room', () => {
    expect(movedExams(dayPlan(), moved({ 21: { roomId: 1, start: '11:00' } })).map(callLine)).toEqual(['ACC-21: MR 2 11:00 → MR 1 11:00']);
  });

  it('returns nothing when no slot moved', () => {
    expect(movedExams(dayPlan(), dayPlan())).toEqual([]);
  });
});

describe('withMoves', () => {
  it('keeps the first old time of a patient moved twice, and drops one moved back', () => {
    const first = movedExams(dayPlan(), moved({ 2: { start: '08:55' }, 3: { start: '09:55' } }));
    const second = movedExams(moved({ 2: { start: '08:55' }, 3: { start: '09:55' } }), moved({ 2: { start: '09:00' }, 3: { start: '09:45' } }));
    expect(withMoves(first, second).map(callLine)).toEqual(['ACC-2: MR 1 08:45 → 09:00']);
  });
});

describe('callsCsv', () => {
  it('writes one row per patient with old and new room and time, CRLF line ends', () => {
    const csv = callsCsv('2027-03-15', movedExams(dayPlan(), moved({ 2: { start: '08:55' } })));
    expect(csv).toBe('date,accession,old_room,old_start,new_room,new_start\r\n2027-03-15,ACC-2,MR 1,08:45,MR 1,08:55\r\n');
  });
});

import { roomSequence } from './room-sequence';
import { exampleExam, exampleGap, exampleRoom } from './testing/example-plan';

// Five exams in one room: opening fits, 1→2 fits, 2→3 short, 3→4 fits, 4→5 fits.
const exams = [
  exampleExam(3, '09:30', '10:00'),
  exampleExam(1, '08:00', '08:30'),
  exampleExam(2, '08:50', '09:20'),
  exampleExam(4, '10:30', '11:00'),
  exampleExam(5, '11:30', '12:00'),
];
const gaps = [
  exampleGap(null, 1, 'fits'),
  exampleGap(1, 2, 'fits'),
  exampleGap(2, 3, 'short', { shortByMinutes: 10 }),
  exampleGap(3, 4, 'fits'),
  exampleGap(4, 5, 'fits'),
];
const room = exampleRoom(exams, gaps);

function describeItems(items: ReturnType<typeof roomSequence>): string[] {
  return items.map((item) =>
    item.kind === 'exam' ? `exam ${item.exam.id}` : item.kind === 'gap' ? `gap ${item.from?.id ?? 'open'}→${item.to.id}` : `hidden ${item.exams}`,
  );
}

describe('roomSequence', () => {
  it('returns the exams in time order with each gap before the exam it leads to, the opening first', () => {
    expect(describeItems(roomSequence(room))).toEqual([
      'gap open→1', 'exam 1', 'gap 1→2', 'exam 2', 'gap 2→3', 'exam 3', 'gap 3→4', 'exam 4', 'gap 4→5', 'exam 5',
    ]);
  });

  it('with onlyProblems, keeps problem gaps and the exams around them, and counts the rest', () => {
    expect(describeItems(roomSequence(room, true))).toEqual(['hidden 1', 'exam 2', 'gap 2→3', 'exam 3', 'hidden 2']);
  });

  it('with onlyProblems, returns nothing for a room whose gaps all fit', () => {
    const calm = exampleRoom(exams, gaps.map((gap) => ({ ...gap, verdict: 'fits' as const })));
    expect(roomSequence(calm, true)).toEqual([]);
  });

  it('keeps snug gaps as problems', () => {
    const snug = exampleRoom([exampleExam(1, '08:00', '08:30'), exampleExam(2, '08:50', '09:20')], [exampleGap(1, 2, 'snug')]);
    expect(describeItems(roomSequence(snug, true))).toEqual(['exam 1', 'gap 1→2', 'exam 2']);
  });

  it('leaves out a gap that names an exam not on the list rather than failing', () => {
    const odd = exampleRoom([exampleExam(1, '08:00', '08:30')], [exampleGap(99, 98, 'short')]);
    expect(describeItems(roomSequence(odd))).toEqual(['exam 1']);
  });
});

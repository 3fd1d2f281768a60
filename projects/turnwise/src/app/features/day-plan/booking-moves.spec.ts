import type { PlanChange, PlanChangeRecord } from '@shared/api/changes';

import { movedByBookingSystem } from './booking-moves';

const move = (examId: number): PlanChange => ({ type: 'move', examId, accession: `ACC-${examId}`, from: { roomId: 1, start: '2027-03-15T08:00:00-05:00' }, to: { roomId: 1, start: '2027-03-15T08:15:00-05:00' } });
let nextId = 100;
function record(changes: PlanChange[], extra: Partial<PlanChangeRecord> = {}): PlanChangeRecord {
  return { id: nextId--, day: '2027-03-15', username: 'u', displayName: 'U', reason: 'drag', summary: '', changes, revertsId: null, undone: false, afterManualChange: false, at: '2027-03-15T08:00:00-05:00', ...extra };
}
const feed = (examId: number) => record([move(examId)], { reason: 'hl7', afterManualChange: true });

describe('movedByBookingSystem', () => {
  it('returns the exams whose newest change is a flagged feed change', () => {
    // newest first, as GET …/history answers
    expect([...movedByBookingSystem([feed(2), record([move(1)]), record([move(2)])])]).toEqual([2]);
  });

  it('drops the mark once a later change touches the exam, by hand or by the feed', () => {
    expect(movedByBookingSystem([record([move(2)]), feed(2)]).size).toBe(0);
    expect(movedByBookingSystem([record([move(2)], { reason: 'hl7' }), feed(2)]).size).toBe(0);
  });

  it('skips undone changes and staffing changes', () => {
    expect([...movedByBookingSystem([record([move(2)], { undone: true }), feed(2)])]).toEqual([2]);
    const staffing: PlanChange = { type: 'staffing', toExamId: 2, accession: 'ACC-2', from: null, to: 2 };
    expect([...movedByBookingSystem([record([staffing]), feed(2)])]).toEqual([2]);
  });

  it('returns nothing for an empty history', () => {
    expect(movedByBookingSystem([]).size).toBe(0);
  });
});

import { computeDayPlan } from '../turnover/day-plan';
import { fixDay } from './fix-day';
import { randomDay } from './testing/random-day';

describe('judgeRoom (through fixDay)', () => {
  it('judges every gap as computeDayPlan does, on invented crowded days, the spring-forward day included', () => {
    for (let seed = 1; seed <= 60; seed++) {
      const input = randomDay(seed, seed % 4 === 0 ? '2027-03-14' : '2027-03-15');
      const plan = computeDayPlan(input);
      const day = fixDay(input);
      for (const room of plan.rooms) {
        const judged = day.judged(room.id);
        const fields = ({ fromExamId, toExamId, availableMinutes, requiredMinutes, verdict, shortByMinutes, staff }: (typeof room.gaps)[number]) =>
          ({ fromExamId, toExamId, availableMinutes, requiredMinutes, verdict, shortByMinutes, staff });
        expect([seed, room.id, judged.gaps]).toEqual([seed, room.id, room.gaps.map(fields)]);
        const ends = Math.max(Date.parse(room.opensAt), ...room.exams.map((e) => Date.parse(e.end)));
        expect([seed, room.id, judged.endsMs]).toEqual([seed, room.id, ends]);
      }
      expect(day.summary).toEqual(plan.summary);
    }
  });

  it('judges an empty room: no gaps, its day ends at its opening', () => {
    const input = { ...randomDay(3), exams: [] };
    const day = fixDay(input);
    const room = input.rooms[0]!;
    expect(day.judged(room.id).gaps).toEqual([]);
    expect(day.format(day.judged(room.id).endsMs)).toBe(computeDayPlan(input).rooms[0]!.opensAt);
  });

  it('refuses a day with an exam in an unknown room, as the engine does', () => {
    const input = randomDay(5);
    expect(() => fixDay({ ...input, exams: [{ ...input.exams[0]!, roomId: 999 }] })).toThrow(/unknown room 999/);
  });
});

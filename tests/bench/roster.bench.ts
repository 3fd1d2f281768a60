import type { DayPlanExam, DayPlanInput, DayPlanPerson, DayPlanRoom } from '../../shared/turnover';
import { computeDayPlan } from '../../shared/turnover';
import { DEMO_SETUP } from '../../shared/turnover/demo-protocols';
import { seededRandom } from '../../shared/turnover/testing/seeded-random';

const RUNS = 7;
const hhmm = (minute: number) => `${String(Math.floor(minute / 60)).padStart(2, '0')}:${String(minute % 60).padStart(2, '0')}`;

/**
 * An invented MR day with a roster: `rooms` rooms of 10–25 minute exams (gaps 15–35 min; none after 20:00), and
 * people in early and late shifts with staggered breaks, each covering `covers` neighbouring rooms.
 */
export function rosterDay(rooms: number, examsPerRoom: number, people: number, covers: number): DayPlanInput {
  const next = seededRandom(20270503);
  const roomList: DayPlanRoom[] = Array.from({ length: rooms }, (_, i) => ({ id: i + 1, name: `MR ${i + 1}`, modality: 'MR', staff: 1 + (i % 3 === 0 ? 1 : 0), airChangesPerHour: 8 }));
  const exams: DayPlanExam[] = [];
  for (const room of roomList) {
    let minute = 7 * 60 + 10 + Math.floor(next() * 20);
    for (let k = 0; k < examsPerRoom && minute < 20 * 60; k++) {
      const durationMinutes = 10 + Math.floor(next() * 16);
      exams.push({
        id: exams.length + 1, accession: `RB${exams.length + 1}`, roomId: room.id, start: `2027-05-03T${hhmm(minute)}:00-05:00`, durationMinutes,
        procedure: 'MR invented procedure', coil: next() < 0.5 ? 'knee' : 'head', precaution: next() < 0.05 ? 'contact' : 'none', mobility: 'ambulatory', contrast: next() < 0.3, notes: null, version: 1,
      });
      minute += durationMinutes + 15 + Math.floor(next() * 21);
    }
  }
  const staff: DayPlanPerson[] = Array.from({ length: people }, (_, p) => {
    const early = p % 2 === 0;
    const lunch = (early ? 11 * 60 : 14 * 60) + (p % 4) * 15;
    return {
      id: `p${p + 1}`, name: null, label: `Aide ${p + 1}`, role: 'aide', start: early ? '07:00' : '12:00', end: early ? '15:30' : '20:30',
      breaks: [{ start: hhmm(lunch), end: hhmm(lunch + 30) }],
      roomIds: Array.from({ length: covers }, (_, k) => ((Math.floor(p / 2) * covers + k) % rooms) + 1),
    };
  });
  return { date: '2027-05-03', timezone: 'America/Chicago', ...DEMO_SETUP, rooms: roomList, exams, roster: { source: 'day', people: staff, walkingMinutes: 3 } };
}

/**
 * Times the day plan with a roster (the crews found across rooms) against the same day without
 * one, and says whether the crews were proven optimal within the search's budget.
 *
 * @example
 * for (const line of await benchRoster()) console.log(line);
 */
export async function benchRoster(): Promise<string[]> {
  const lines: string[] = [];
  for (const [rooms, perRoom, people, covers] of [[4, 20, 6, 2], [4, 20, 3, 4], [40, 30, 60, 2], [40, 30, 30, 4]] as const) {
    const input = rosterDay(rooms, perRoom, people, covers);
    const time = (day: DayPlanInput) => {
      const runs: number[] = [];
      let plan = computeDayPlan(day);
      for (let k = 0; k < RUNS; k++) {
        const t0 = performance.now();
        plan = computeDayPlan(day);
        runs.push(performance.now() - t0);
      }
      return { median: runs.sort((a, b) => a - b)[Math.floor(RUNS / 2)]!, plan };
    };
    const rostered = time(input);
    const bare = time({ ...input, roster: undefined });
    const s = rostered.plan.summary;
    lines.push(
      `roster: ${input.exams.length} exams / ${rooms} rooms, ${people} people covering ${covers} rooms each — ${rostered.median.toFixed(1)} ms ` +
        `(without a roster ${bare.median.toFixed(1)} ms); proven optimal: ${rostered.plan.people!.provenOptimal}; ` +
        `short ${s.short} (${bare.plan.summary.short} without), overlap ${s.overlap}, ${s.minutesShort} min short`,
    );
  }
  return lines;
}

import { fitDay } from './instance';
import { DEMO_SETUP } from '../turnover/demo-protocols';
import { MOBILITIES, PRECAUTIONS } from '../turnover/model';
import type { DayPlanExam, DayPlanInput } from '../turnover/day-plan-input';

/**
 * The model requires every earlier exam's turnover, not only the previous one's; that equals the
 * plan's gap-by-gap rule when required(i,j) ≤ required(i,k) + duration(k) + required(k,j) (and
 * the opening steps likewise). Checked here for the demo protocols over every kind of exam,
 * with the shortest duration an exam list allows (5 min), each staff size and two air-change rates.
 */
describe('the turnover triangle rule the day-fit model relies on', () => {
  const kinds: DayPlanExam[] = [];
  for (const precaution of PRECAUTIONS) {
    for (const mobility of MOBILITIES) {
      for (const coil of ['head', 'knee']) {
        for (const contrast of [false, true]) {
          kinds.push({ id: kinds.length + 1, accession: `K-${kinds.length + 1}`, roomId: 1, start: '2027-03-16T08:00:00-05:00', durationMinutes: 5, procedure: 'invented', coil, precaution, mobility, contrast, version: 1 });
        }
      }
    }
  }
  for (const modality of ['MR', 'CT']) {
    for (const airChangesPerHour of [6, 12]) {
      it(`holds for ${modality} rooms with ${airChangesPerHour} air changes, 1 to 3 people`, () => {
        const room = { id: 1, name: `${modality} 1`, modality, staff: 1, airChangesPerHour };
        const input: DayPlanInput = { date: '2027-03-16', timezone: 'America/Chicago', ...DEMO_SETUP, rooms: [room], exams: kinds };
        const day = fitDay(input, {});
        let checked = 0;
        for (const staff of [1, 2, 3]) {
          const req = (a: DayPlanExam | null, b: DayPlanExam) => day.required(room, a, b, staff);
          for (const k of kinds) {
            for (const j of kinds) {
              expect(req(null, j) <= req(null, k) + 5 + req(k, j) || [null, k.id, j.id]).toBe(true);
              for (const i of kinds) {
                const ok = req(i, j) <= req(i, k) + 5 + req(k, j);
                if (!ok) expect([i.id, k.id, j.id, staff]).toBe('a triangle that holds');
                checked++;
              }
            }
          }
        }
        expect(checked).toBe(3 * kinds.length ** 3);
      }, 120_000);
    }
  }
});

import type { Checklist } from '../../shared/api/board';
import { EXAM_LIST_HEADER } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { at, DAY, examId, importDay, local, roomId, row } from './turnover-day';

/**
 * The checklist follows what happened and the day as it is now: countdowns from the recorded
 * end, the clean type and the planned times recomputed.
 */
describe('the turnover checklist over time', () => {
  let h: Harness;
  let tech: Client;
  let scheduler: Client;
  let mr2: number;

  beforeEach(async () => {
    h = await startHarness();
    tech = await signedIn(h.app, 'tech');
    scheduler = await signedIn(h.app, 'scheduler');
    mr2 = await roomId(h, 'MR 2');
  });
  afterEach(() => h.close());

  const checklist = async (): Promise<Checklist> => (await tech.get(`/api/rooms/${mr2}/turnover?date=${DAY}`)).body;
  const finish = (accession: string, body: object = {}) => examId(h, accession).then((id) => tech.post(`/api/exams/${id}/finished`, body));

  it('runs no air-hold countdown before the airborne exam is finished, and flags a planned hold past the next start', async () => {
    await importDay(scheduler, [EXAM_LIST_HEADER, row('T-1', 'MR 2', '09:00', 30, 'airborne'), row('T-2', 'MR 2', '10:00', 30)]);
    at(h, '09:10'); // T-1 is being scanned: the room is not empty, nothing to count down
    const before = await checklist();
    // CDC 2003, Appendix B, Table B.1: 12 ACH (MR 2 in the demo centre) → 35 min for 99.9 %
    expect(before).toMatchObject({ turnoverId: null, examEndedAt: null, airHoldMinutes: 35, airHoldUntil: null, airHoldPlannedUntil: local('10:05') });
    // planned 09:30 end + 35 min = 10:05, five minutes into T-2's 10:00 slot
    expect(before.airHoldPastNextStartMinutes).toBe(5);

    at(h, '09:20'); // finished early: the hold counts from the recorded end
    const opened: Checklist = (await finish('T-1')).body;
    expect(opened).toMatchObject({ examEndedAt: local('09:20'), airHoldUntil: local('09:55'), airHoldPlannedUntil: local('09:55'), airHoldPastNextStartMinutes: 0 });
  });

  it('drops the "terminal" clean type when an exam is imported behind the day\'s last one', async () => {
    await importDay(scheduler, [EXAM_LIST_HEADER, row('T-1', 'MR 2', '09:00', 30)]);
    at(h, '09:30');
    expect((await finish('T-1')).body.cleanType).toBe('terminal');

    await importDay(scheduler, [EXAM_LIST_HEADER, row('T-1', 'MR 2', '09:00', 30), row('T-2', 'MR 2', '11:00', 30)]);
    const now = await checklist();
    expect(now).toMatchObject({ leaving: { accession: 'T-1' }, arriving: { accession: 'T-2' }, cleanType: 'routine' });
    const res = await tech.post(`/api/turnovers/${now.turnoverId}/steps/clear/done`, {});
    expect(res.status).toBe(200);
    const { entries } = (await tech.get(`/api/log?date=${DAY}`)).body;
    expect(entries[0]).toMatchObject({ kind: 'step', stepKey: 'clear', cleanType: 'routine' });
  });

  it('re-plans steps not yet ticked from now, never showing a planned time already past', async () => {
    await importDay(scheduler, [EXAM_LIST_HEADER, row('T-1', 'MR 2', '09:00', 30), row('T-2', 'MR 2', '11:00', 30)]);
    at(h, '09:30');
    const opened: Checklist = (await finish('T-1')).body;
    expect(opened.steps[0]).toMatchObject({ key: 'clear', planned: { start: local('09:30') } });
    expect((await tech.post(`/api/turnovers/${opened.turnoverId}/steps/clear/done`, {})).status).toBe(200);

    at(h, '09:50'); // twenty minutes later, nothing else ticked
    const later = await checklist();
    const clear = later.steps.find((s) => s.key === 'clear')!;
    expect(clear.planned.start).toBe(local('09:30')); // done: its plan is history
    const rest = later.steps.filter((s) => !s.done);
    expect(Math.min(...rest.map((s) => Date.parse(s.planned.start)))).toBe(Date.parse(local('09:50')));
    // the order and the gaps between the remaining steps are kept
    const gaps = (c: Checklist) => c.steps.filter((s) => s.key !== 'clear').map((s) => Date.parse(s.planned.start) - Date.parse(c.steps[1]!.planned.start));
    expect(gaps(later)).toEqual(gaps(opened));
    expect(Date.parse(later.readyAt!)).toBeGreaterThanOrEqual(Date.parse(local('09:50')));

    // Half a minute on, the estimate is on a whole minute, up (as Rooms now shows it), never in seconds.
    h.clock.set(local('09:50').replace(':00-', ':30-'));
    const halfway = await checklist();
    expect(new Date(halfway.readyAt!).getUTCSeconds()).toBe(0);
    expect(Date.parse(halfway.readyAt!)).toBe(Date.parse(later.readyAt!) + 60_000);
  });

  it('re-plans the opening from now once the room is open and no exam has started', async () => {
    await importDay(scheduler, [EXAM_LIST_HEADER, row('T-1', 'MR 2', '09:00', 30)]);
    at(h, '07:40');
    const opening = await checklist();
    expect(opening).toMatchObject({ turnoverId: null, leaving: null, arriving: { accession: 'T-1' } });
    expect(opening.steps[0]!.planned.start).toBe(local('07:40'));
  });
});

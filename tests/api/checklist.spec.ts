import type { Checklist } from '../../shared/api/board';
import { EXAM_LIST_HEADER } from '../fixtures/exam-lists';
import { signedIn, startHarness, type Client, type Harness } from './harness';
import { at, DAY, examId, importDay, local, roomId, row, tickAll } from './turnover-day';

describe('the turnover checklist', () => {
  let h: Harness;
  let tech: Client;
  let mr2: number;

  beforeEach(async () => {
    h = await startHarness();
    tech = await signedIn(h.app, 'tech');
    await importDay(await signedIn(h.app, 'scheduler'), [
      EXAM_LIST_HEADER,
      row('C-1', 'MR 2', '08:00', 30, 'none', 'knee'),
      row('C-2', 'MR 2', '09:00', 30, 'enteric', 'head'),
      row('C-3', 'MR 2', '10:00', 30, 'airborne', 'head', 'yes'),
    ]);
    mr2 = await roomId(h, 'MR 2');
  });
  afterEach(() => h.close());

  const finish = async (accession: string): Promise<Checklist> => (await tech.post(`/api/exams/${await examId(h, accession)}/finished`, {})).body;
  const tick = (c: Checklist, key: string, body: object = {}) => tech.post(`/api/turnovers/${c.turnoverId}/steps/${key}/done`, body);
  const checklist = async (): Promise<Checklist> => (await tech.get(`/api/rooms/${mr2}/turnover?date=${DAY}`)).body;

  it('shows the opening before the first exam, then the turnover after the exam in progress', async () => {
    at(h, '06:50');
    const opening = await checklist();
    expect(opening).toMatchObject({ turnoverId: null, leaving: null, arriving: { accession: 'C-1' }, cleanType: 'routine' });
    expect(opening.steps.map((s) => s.key)).toEqual(['workstation', 'roomcheck']);
    expect(opening.steps[0]!.planned.start).toBe(local('07:00'));
    expect(opening.tasks.map((t) => t.key)).toEqual(['wipe-start', 'scanner-qa', 'wipe-end']);

    at(h, '08:10');
    const next = await checklist();
    expect(next).toMatchObject({ turnoverId: null, leaving: { accession: 'C-1' }, arriving: { accession: 'C-2' }, examEndedAt: null });
    // a coil change (knee → head) adds 2 min to placing the coil: 22 in all (product brief)
    expect(next.readyAt).toBe(local('08:52'));
  });

  it('"exam finished" opens the turnover with the steps in the engine\'s order, and refuses a second time (409)', async () => {
    at(h, '08:32');
    const c = await finish('C-1');
    expect(c.turnoverId).toEqual(expect.any(Number));
    expect(c.examEndedAt).toBe(local('08:32'));
    expect(c.steps[0]!.key).toBe('clear');
    expect(c.steps.at(-1)!.key).toBe('hygiene');
    const starts = c.steps.map((s) => Date.parse(s.planned.start));
    expect(starts).toEqual([...starts].sort((a, b) => a - b));
    expect(c.steps.find((s) => s.key === 'coilset')).toMatchObject({ handsOnMinutes: 3, needsDry: ['table', 'coils'] });
    expect(await checklist()).toMatchObject({ turnoverId: c.turnoverId });

    const again = await tech.post(`/api/exams/${await examId(h, 'C-1')}/finished`, {});
    expect(again.status).toBe(409);
    expect(again.body.error.message).toMatch(/already recorded at 08:32/);
    expect(again.body.error).toMatchObject({ code: 'already_done', details: { at: local('08:32') } });
  });

  it('refuses a step on a still-wet surface without a reason (422 naming until when), and logs it with one', async () => {
    at(h, '08:30');
    let c = await finish('C-1');
    for (const key of ['clear', 'table']) expect((await tick(c, key)).status).toBe(200);
    at(h, '08:32');
    const refused = await tick(c, 'linen');
    expect(refused.status).toBe(422);
    // table: 2 min label contact (standard wipe) + 2 min dry from the 08:30 tick
    expect(refused.body.error.message).toMatch(/"Table top and rails" stays wet until 08:34:00/);
    expect(refused.body.error).toMatchObject({ code: 'surface_wet', details: { wet: ['table'], wetUntil: local('08:34') } });

    const early = await tick(c, 'linen', { earlyReason: 'Sheet laid on the dry end only' });
    expect(early.status).toBe(200);
    c = early.body;
    expect(c.steps.find((s) => s.key === 'linen')!.done).toMatchObject({ at: local('08:32'), by: 'Mika Lindahl', earlyReason: 'Sheet laid on the dry end only' });
    const { entries } = (await tech.get(`/api/log?date=${DAY}`)).body;
    expect(entries[0]).toMatchObject({ kind: 'step', stepKey: 'linen', earlyReason: 'Sheet laid on the dry end only', username: 'tech' });
  });

  it('refuses a step whose needs are not ticked yet, a step ticked twice (409) and an unknown step (404)', async () => {
    at(h, '08:30');
    const c = await finish('C-1');
    const first = await tick(c, 'bore');
    expect(first.status).toBe(422);
    expect(first.body.error.message).toMatch(/Tick "Patient out; coil, pads and linen off" first/);
    expect(first.body.error).toMatchObject({ code: 'steps_missing', details: { missing: ['clear'] } });
    expect((await tick(c, 'clear')).status).toBe(200);
    const twice = await tick(c, 'clear');
    expect([twice.status, twice.body.error.code]).toEqual([409, 'already_done']);
    expect((await tick(c, 'no-such-step')).status).toBe(404);
  });

  it('defaults the product from the protocol (sporicidal after an enteric case) and lets the technologist change it', async () => {
    at(h, '08:30');
    // the demo's products as the seed stored them: the engine keys a product by its id
    const key = async (name: string) => String((await h.db('products').where({ name }).first('id')).id);
    const [standard, sporicidal] = [await key('Standard surface wipe'), await key('Sporicidal wipe')];
    const routine = await finish('C-1');
    expect(routine.steps.find((s) => s.key === 'bore')).toMatchObject({ productKey: standard, contactMinutes: 2, waitMinutes: 6 });
    await tick(routine, 'clear');
    const changed = await tick(routine, 'bore', { productKey: sporicidal });
    expect(changed.status).toBe(200);
    // sporicidal wipe (demo label: 4 min contact) + the bore's 4 min dry time, from the tick
    expect(changed.body.steps.find((s: { key: string }) => s.key === 'bore')).toMatchObject({ done: { productKey: sporicidal }, wetUntil: local('08:38') });
    expect((await tick(routine, 'table', { productKey: 'not-a-product' })).status).toBe(422);
    expect((await tick(routine, 'linen', { productKey: standard })).status).toBe(422); // a step that disinfects nothing

    at(h, '09:30');
    const enteric = await finish('C-2');
    expect(enteric).toMatchObject({ cleanType: 'isolation', precaution: 'enteric' });
    expect(enteric.steps.find((s) => s.key === 'bore')).toMatchObject({ productKey: sporicidal, contactMinutes: 4 });
    expect(enteric.steps[0]!.key).toBe('don');
    const { entries } = (await tech.get(`/api/log?date=${DAY}&roomId=${mr2}`)).body;
    expect(entries.find((e: { stepKey: string }) => e.stepKey === 'bore')).toMatchObject({ productName: 'Sporicidal wipe', contactRequiredMinutes: 4 });
  });

  it('completes only when every step is done (422 listing the missing ones), then refuses changes (409)', async () => {
    at(h, '08:30');
    const c = await finish('C-1');
    await tick(c, 'clear');
    const refused = await tech.post(`/api/turnovers/${c.turnoverId}/complete`, {});
    expect(refused.status).toBe(422);
    expect(refused.body.error.code).toBe('steps_missing');
    expect(refused.body.error.details.missing).toEqual(expect.arrayContaining(['bore', 'table', 'hygiene']));
    expect(refused.body.error.details.missing).not.toContain('clear');

    const done = await tickAll(h, tech, (await checklist()));
    // right after the last tick some surfaces are still wet: closing then needs a reason
    const wet = await tech.post(`/api/turnovers/${c.turnoverId}/complete`, {});
    expect(wet.status).toBe(422);
    expect(wet.body.error.message).toMatch(/stays wet until/);
    expect(wet.body.error.code).toBe('surface_wet');
    expect(wet.body.error.details.wet.length).toBeGreaterThan(0);
    h.clock.advance(15); // every surface dry: the demo waits are at most 4 min contact + 4 min dry
    const ok = await tech.post(`/api/turnovers/${c.turnoverId}/complete`, {});
    expect(ok.status).toBe(200);
    expect(ok.body.completedAt).toBe(ok.body.now);
    expect(ok.body.completedAt).not.toBeNull();
    const closed = await tech.post(`/api/turnovers/${done.turnoverId}/complete`, {});
    expect(closed.status).toBe(409);
    expect(closed.body.error).toMatchObject({ code: 'turnover_complete', details: { completedAt: ok.body.completedAt } });
    expect((await tick(done, 'clear')).body.error.code).toBe('turnover_complete');
  });

  it('makes the room ready during an air hold only with an override reason, which is logged', async () => {
    at(h, '10:30');
    const c = await finish('C-3'); // the day's last exam, airborne precautions, MR 2 at 12 ACH
    // CDC 2003, Appendix B, Table B.1: 12 ACH → 35 min for 99.9 % removal; ours is ceil(60·ln(1000)/12) = 35
    expect(c).toMatchObject({ cleanType: 'terminal', airHoldMinutes: 35, airHoldUntil: local('11:05') });
    await tickAll(h, tech, c);
    const holding = await tech.post(`/api/turnovers/${c.turnoverId}/complete`, {});
    expect(holding.status).toBe(422);
    expect(holding.body.error).toMatchObject({ code: 'air_hold', details: { until: local('11:05'), airHoldUntil: local('11:05') } });
    const res = await tech.post(`/api/turnovers/${c.turnoverId}/complete`, { overrideReason: 'Room has 15 ACH since the new unit was fitted' });
    expect(res.status).toBe(200);
    const { entries } = (await tech.get(`/api/log?date=${DAY}`)).body;
    expect(entries[0]).toMatchObject({ kind: 'turnover complete', cleanType: 'terminal', earlyReason: 'Room has 15 ACH since the new unit was fitted' });
  });

  it('lets the front desk read the checklist but not tick it (403), and undo a mistaken arrival', async () => {
    at(h, '08:30');
    const c = await finish('C-1');
    const frontdesk = await signedIn(h.app, 'frontdesk');
    expect((await frontdesk.get(`/api/rooms/${mr2}/turnover?date=${DAY}`)).body.turnoverId).toBe(c.turnoverId);
    expect((await frontdesk.post(`/api/turnovers/${c.turnoverId}/steps/clear/done`, {})).status).toBe(403);
    const c2 = await examId(h, 'C-2');
    expect((await frontdesk.post(`/api/exams/${c2}/arrived`, {})).status).toBe(200);
    expect((await frontdesk.get(`/api/days/${DAY}/board`)).body.rooms.find((r: { roomId: number }) => r.roomId === mr2).next.arrivedAt).toBe(local('08:30'));
    expect((await frontdesk.delete(`/api/exams/${c2}/arrived`)).status).toBe(200);
    expect((await frontdesk.get(`/api/days/${DAY}/board`)).body.rooms.find((r: { roomId: number }) => r.roomId === mr2).next.arrivedAt).toBeNull();
  });
});

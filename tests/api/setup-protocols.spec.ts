import request from 'supertest';
import type { PlannedDay } from '../../shared/api/plan';
import { SHORT_CONTACT_CAUTION, type ProtocolBody, type ProtocolBodyInput } from '../../shared/api/protocols';
import { computeDayPlan } from '../../shared/turnover';
import { createRoom } from '../../server/services/rooms';
import { toEngineProtocol } from '../../server/services/site-setup';
import { DayEvents } from '../../server/services/day-events';
import { createUser } from '../../server/services/users';
import { roomInputSchema } from '../../shared/api/rooms';
import { signedIn, startHarness, type Client, type Harness } from './harness';

// Harness clock 2027-03-10T14:00:00Z = 08:00 in the demo site's America/Chicago: today is 2027-03-10.
const TODAY = '2027-03-10';
const TOMORROW = '2027-03-11';
const YESTERDAY = '2027-03-09';

type Problem = { field: string; message: string };
const fields = (res: request.Response) => (res.body.error.details.problems as Problem[]).map((p) => p.field);

describe('Setup: products and versioned protocols', () => {
  let h: Harness;
  let admin: Client;
  const events = new DayEvents();
  beforeAll(async () => {
    h = await startHarness({ seedDay: true, now: '2027-03-10T14:00:00Z', events });
    admin = await signedIn(h.app, 'admin');
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  const productId = async (name: string) => (await h.db('products').where({ name }).first('id')).id as number;
  const plan = async (day: string) => (await admin.get(`/api/days/${day}/plan`)).body as PlannedDay;
  const currentBody = async (modality: string) => {
    const list = await admin.get('/api/protocols');
    return list.body.protocols.find((p: { modality: string }) => p.modality === modality).current.body as ProtocolBody;
  };

  describe('products', () => {
    it('creates a product with its label contact time, lists it and writes one audit row', async () => {
      const made = await admin.post('/api/products', { name: 'Peroxide wipe', kind: 'standard', contactMinutes: 3, registration: 'REG-123', notes: 'invented' });
      expect(made.status).toBe(201);
      expect(made.body).toMatchObject({ product: { name: 'Peroxide wipe', kind: 'standard', contactMinutes: 3, staysWetMinutes: null, applications: 1, retired: false, usedBy: [] }, warnings: [] });
      const list = await admin.get('/api/products');
      expect(list.body.products.map((p: { name: string }) => p.name)).toContain('Peroxide wipe');
      const audit = await admin.get('/api/audit?limit=5');
      expect(audit.body.entries[0]).toMatchObject({ area: 'product', action: 'created', subject: 'Peroxide wipe', before: null });
    });

    it('refuses every problem at once, with field paths (422)', async () => {
      const res = await admin.post('/api/products', { name: '', kind: 'bleachy', contactMinutes: 0, staysWetMinutes: -1 });
      expect(res.status).toBe(422);
      expect(fields(res).sort()).toEqual(['contactMinutes', 'kind', 'name', 'staysWetMinutes']);
      const twice = await admin.post('/api/products', { name: 'peroxide WIPE', kind: 'other', contactMinutes: 2 });
      expect([twice.status, fields(twice)]).toEqual([422, ['name']]);
    });

    it('saves a contact time under 1 minute with the caution (CDC/HICPAC 2008 Guideline for Disinfection and Sterilization, Table 1: ≥ 1 min for low-level disinfection of noncritical surfaces)', async () => {
      const res = await admin.post('/api/products', { name: 'Fast wipe', kind: 'standard', contactMinutes: 0.5 });
      expect(res.status).toBe(201);
      expect(res.body.warnings).toEqual([{ field: 'contactMinutes', message: SHORT_CONTACT_CAUTION }]);
      expect(SHORT_CONTACT_CAUTION).toMatch(/CDC’s 2008 Guideline for Disinfection and Sterilization in Healthcare Facilities/);
      expect(SHORT_CONTACT_CAUTION).toMatch(/label/);
      // exactly 1 minute meets the guideline: no caution
      const ok = await admin.put(`/api/products/${res.body.product.id}`, { name: 'Fast wipe', kind: 'standard', contactMinutes: 1 });
      expect([ok.status, ok.body.warnings]).toEqual([200, []]);
    });

    it('says how many applications a product that dries first needs (re-wet rule)', async () => {
      // derived: the surface must stay wet for the whole label contact time — common practice, no source.
      // Invented product: 3 min contact, stays wet 1.25 min → ⌈3 ÷ 1.25⌉ = ⌈2.4⌉ = 3 applications.
      const res = await admin.post('/api/products', { name: 'Quick-dry wipe', kind: 'standard', contactMinutes: 3, staysWetMinutes: 1.25 });
      expect(res.body.product).toMatchObject({ staysWetMinutes: 1.25, applications: 3 });
    });

    it('refuses to retire a product a current protocol uses (409 naming the modalities), retires an unused one', async () => {
      const used = await admin.post(`/api/products/${await productId('Standard surface wipe')}/retire`, {});
      expect(used.status).toBe(409);
      expect(used.body.error).toMatchObject({ code: 'product_in_use', details: { modalities: ['*', 'CT', 'MR'] } });
      const unused = await admin.post(`/api/products/${await productId('Peroxide wipe')}/retire`, {});
      expect([unused.status, unused.body.product.retired]).toEqual([200, true]);
      expect((await admin.put(`/api/products/${await productId('Peroxide wipe')}`, { name: 'Peroxide wipe', kind: 'standard', contactMinutes: 2 })).status).toBe(404);
      expect((await admin.post('/api/products/9999/retire', {})).status).toBe(404);
    });
  });

  describe('protocol validation', () => {
    const step = (key: string, label: string, extra: Partial<ProtocolBodyInput['steps'][number]> = {}) => ({ key, label, handsOnMinutes: 1, ...extra });

    it('lists every problem with form paths: cycles named in order, unknown needs, duplicate keys, products, hands-on, past dates (422)', async () => {
      const retired = await productId('Peroxide wipe');
      const res = await admin.post('/api/protocols', {
        modality: 'CT',
        effectiveFrom: YESTERDAY,
        body: {
          steps: [
            step('bore', 'Bore', { needs: [{ key: 'table', dry: true }] }),
            step('table', 'Table', { needs: [{ key: 'linen' }] }),
            step('linen', 'Linen', { needs: [{ key: 'bore' }, { key: 'ghost' }] }),
            step('wipe', 'Wipe', { disinfects: true }),
            step('wipe', 'Wipe again', { disinfects: true, productId: retired }),
            step('long', 'Too long', { handsOnMinutes: 121 }),
          ],
        },
      });
      expect(res.status).toBe(422);
      expect(res.body.error.code).toBe('validation_failed');
      // hands-on 0–120 is the schema's; the rest is checked once the schema passes
      expect(fields(res)).toEqual(['body.steps.5.handsOnMinutes']);

      const next = await admin.post('/api/protocols', {
        modality: 'CT',
        effectiveFrom: YESTERDAY,
        body: {
          steps: [
            step('bore', 'Bore', { needs: [{ key: 'table', dry: true }] }),
            step('table', 'Table', { needs: [{ key: 'linen' }] }),
            step('linen', 'Linen', { needs: [{ key: 'bore' }, { key: 'ghost' }] }),
            step('wipe', 'Wipe', { disinfects: true }),
            step('wipe', 'Wipe again', { disinfects: true, productId: retired }),
          ],
        },
      });
      expect(next.status).toBe(422);
      const problems = next.body.error.details.problems as Problem[];
      expect(problems.map((p) => p.field).sort()).toEqual(
        ['body.steps', 'body.steps.2.needs.1.key', 'body.steps.3.productId', 'body.steps.4.key', 'body.steps.4.productId', 'effectiveFrom'].sort(),
      );
      expect(problems.find((p) => p.field === 'body.steps')!.message).toBe('needs form a cycle: "Bore" → "Linen" → "Table" → "Bore"');
      expect(problems.find((p) => p.field === 'body.steps.4.productId')!.message).toMatch(/retired/);
      expect(problems.find((p) => p.field === 'effectiveFrom')!.message).toMatch(/2027-03-10/);
    });

    it('refuses an unknown modality code and an unknown version (DICOM PS3.3 C.7.3.1.1.1 codes; * the fallback)', async () => {
      const bad = await admin.post('/api/protocols', { modality: 'M R', effectiveFrom: TODAY, body: { steps: [step('a', 'A')] } });
      expect([bad.status, fields(bad)]).toEqual([422, ['modality']]);
      expect((await admin.get('/api/protocols/MR/versions/99')).status).toBe(404);
      expect((await admin.get('/api/protocols/MR/versions/1')).body.protocol).toMatchObject({ modality: 'MR', version: 1, effectiveFrom: '2020-01-01' });
    });
  });

  describe('versions', () => {
    it('a future version applies only from its date; a past day and today keep theirs; the plan names the version', async () => {
      const before = await plan(TODAY);
      const mr = before.rooms.find((r) => r.modality === 'MR')!;
      expect(mr.protocol).toMatchObject({ modality: 'MR', version: 1, effectiveFrom: '2020-01-01' });

      const body = await currentBody('MR');
      const slower = { ...body, steps: body.steps.map((s) => (s.key === 'clear' ? { ...s, handsOnMinutes: s.handsOnMinutes + 6 } : s)) };
      const published: string[] = [];
      const stop = events.subscribe(TODAY, (e) => published.push(`${e.kind}:${e.reason}`));
      const saved = await admin.post('/api/protocols', { modality: 'MR', effectiveFrom: TOMORROW, note: 'linen bagging', body: slower });
      stop();
      expect(saved.status).toBe(201);
      // every open day screen fetches its plan and board again
      expect(published).toEqual(['plan:setup', 'board:setup']);
      expect(saved.body.protocol).toMatchObject({ modality: 'MR', version: 2, effectiveFrom: TOMORROW, createdBy: { username: 'admin' } });

      const today = await plan(TODAY);
      expect(today.rooms.find((r) => r.modality === 'MR')!.protocol!.version).toBe(1);
      expect(today.summary).toEqual(before.summary);
      expect((await plan(TOMORROW)).rooms.find((r) => r.modality === 'MR')!.protocol).toMatchObject({ version: 2, effectiveFrom: TOMORROW });

      const list = await admin.get('/api/protocols');
      const entry = list.body.protocols.find((p: { modality: string }) => p.modality === 'MR');
      expect([entry.current.version, entry.future.map((v: { version: number }) => v.version), entry.history]).toEqual([1, [2], []]);
      const audit = await admin.get('/api/audit?limit=1');
      expect(audit.body.entries[0]).toMatchObject({ area: 'protocol', action: 'version added', subject: 'MR', after: { version: 2, effectiveFrom: TOMORROW } });
    });

    it("changes today's verdicts exactly as the engine predicts, while a running turnover and yesterday keep version 1", async () => {
      const before = await plan(TODAY);
      // a turnover begun under version 1 (a technologist records the end of MR 1's first exam)
      const tech = await signedIn(h.app, 'tech');
      const mr1 = before.rooms.find((r) => r.name === 'MR 1')!;
      h.clock.set(new Date(Date.parse(mr1.exams[0]!.end)));
      const finished = await tech.post(`/api/exams/${mr1.exams[0]!.id}/finished`, {});
      expect(finished.status).toBe(201);

      const body = await currentBody('MR');
      const slower = { ...body, steps: body.steps.map((s) => (s.key === 'clear' ? { ...s, handsOnMinutes: s.handsOnMinutes + 8 } : s)) };
      const saved = await admin.post('/api/protocols', { modality: 'MR', effectiveFrom: TODAY, body: slower });
      expect(saved.status).toBe(201);
      expect(saved.body.protocol.version).toBe(3);

      const after = await plan(TODAY);
      expect(after.rooms.find((r) => r.modality === 'MR')!.protocol).toMatchObject({ version: 3, effectiveFrom: TODAY });
      // the expectation: the engine run on the day's old input with only the MR protocol replaced
      const expected = computeDayPlan({ ...before.input, protocols: { ...before.input.protocols, MR: toEngineProtocol({ ...saved.body.protocol }) } });
      const verdicts = (p: { rooms: { gaps: { toExamId: number; verdict: string; requiredMinutes: number }[] }[] }) =>
        p.rooms.flatMap((r) => r.gaps.map((g) => [g.toExamId, g.verdict, g.requiredMinutes]));
      expect(verdicts(after)).toEqual(verdicts(expected));
      expect(after.summary).toEqual(expected.summary);
      expect(after.summary).not.toEqual(before.summary); // 8 more minutes per MR turnover moves verdicts

      expect((await plan(YESTERDAY)).rooms.find((r) => r.modality === 'MR')!.protocol!.version).toBe(1);
      const checklist = await tech.get(`/api/rooms/${mr1.id}/turnover?date=${TODAY}`);
      expect(checklist.body.protocol).toMatchObject({ modality: 'MR', version: 1 });
      const clear = checklist.body.steps.find((s: { key: string }) => s.key === 'clear');
      expect(clear.handsOnMinutes).toBe(body.steps.find((s) => s.key === 'clear')!.handsOnMinutes);
      // and the cleaning log says which version its turnover followed
      const log = await tech.get(`/api/log?date=${TODAY}&roomId=${mr1.id}`);
      expect(log.body.entries.find((e: { kind: string }) => e.kind === 'exam finished').protocol).toEqual({ modality: 'MR', version: 1, effectiveFrom: '2020-01-01' });
    });

    it('previews a draft: required minutes before → after per gap type and the gaps whose verdict would change', async () => {
      const body = await currentBody('CT');
      const slower = { ...body, steps: body.steps.map((s) => (s.key === 'clear' ? { ...s, handsOnMinutes: s.handsOnMinutes + 15 } : s)) };
      const res = await admin.post('/api/protocols/preview', { modality: 'CT', body: slower });
      expect(res.status).toBe(200);
      expect(res.body.days).toHaveLength(8);
      expect(res.body.days[0]).toBe(TODAY);
      const plainGap = res.body.required.find((r: { gapType: string }) => r.gapType === 'plain');
      expect(plainGap.after - plainGap.before).toBe(15); // one person, clear is on the critical path
      // the same engine on the stored day with the draft says which gaps change verdict
      const day = await plan(TODAY);
      const draft = computeDayPlan({ ...day.input, protocols: { ...day.input.protocols, CT: toEngineProtocol({ id: 0, modality: 'CT', version: 0, effectiveFrom: TODAY, body: slower }) } });
      const beforeCt = day.rooms.find((r) => r.modality === 'CT')!.gaps;
      const afterCt = draft.rooms.find((r) => r.modality === 'CT')!.gaps;
      const changed = afterCt.filter((g, i) => g.verdict !== beforeCt[i]!.verdict).map((g) => g.toExamId);
      const reported = res.body.changes.filter((c: { date: string }) => c.date === TODAY).map((c: { accessions: string[] }) => c.accessions[1]);
      const accession = new Map(day.input.exams.map((e) => [e.id, e.accession]));
      expect(reported.sort()).toEqual(changed.map((id) => accession.get(id)).sort());
      expect(changed.length).toBeGreaterThan(0);
      // nothing was saved
      expect((await plan(TODAY)).summary).toEqual(day.summary);
    });

    it('previews a product change and refuses nothing in a preview (its problems are listed instead)', async () => {
      const id = await productId('Standard surface wipe');
      const res = await admin.post(`/api/products/${id}/preview`, { name: 'Standard surface wipe', kind: 'standard', contactMinutes: 12 });
      expect(res.status).toBe(200);
      expect(res.body.warnings).toEqual([]);
      const ct = res.body.required.find((r: { modality: string; gapType: string }) => r.modality === 'CT' && r.gapType === 'plain');
      expect(ct.after).toBeGreaterThan(ct.before); // 10 more minutes of contact on every wiped surface
      expect(res.body.changes.length).toBeGreaterThan(0);
      const short = await admin.post(`/api/products/${id}/preview`, { name: 'Standard surface wipe', kind: 'standard', contactMinutes: 0.5 });
      expect(short.body.warnings).toEqual([{ field: 'contactMinutes', message: SHORT_CONTACT_CAUTION }]);
      const draft = await admin.post('/api/protocols/preview', { modality: 'CT', body: { steps: [{ key: 'a', label: 'A', handsOnMinutes: 1, needs: [{ key: 'a' }] }] } });
      expect(draft.status).toBe(200);
      expect(draft.body.problems.map((p: Problem) => p.field)).toContain('body.steps.0.needs.0.key');
      expect(draft.body.changes).toEqual([]);
    });

    it('answers the setup checklist for an admin', async () => {
      const res = await admin.get('/api/setup/checklist');
      expect(res.status).toBe(200);
      expect(res.body.items.map((i: { key: string }) => i.key)).toEqual(['rooms', 'products', 'protocols', 'users']);
      expect(res.body.items.find((i: { key: string }) => i.key === 'protocols').done).toBe(true);
    });
  });
});

describe('production boot: no demo rules anywhere', () => {
  // what server/main.ts leaves when NODE_ENV=production: migrated, the reference data, no demo seed
  let h: Harness;
  let db: Harness['db'];
  let app: Harness['app'];
  let clock: Harness['clock'];
  beforeAll(async () => {
    h = await startHarness({ bare: true, now: '2027-03-10T14:00:00Z', demo: false, production: true, trustProxy: ['loopback'] });
    ({ db, app, clock } = h);
  }, 30_000);
  afterAll(() => h.close(), 30_000);

  /** Production cookies are Secure: the calls come as from a TLS-terminating proxy, the cookies sent back by hand. */
  const https = (t: request.Test) => t.set('X-Forwarded-Proto', 'https');
  async function signInAs(username: string, password: string) {
    const health = await https(request(app).get('/api/health'));
    const xsrf = (health.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('XSRF-TOKEN='))!.split(';')[0]!;
    const token = decodeURIComponent(xsrf.split('=').slice(1).join('='));
    const login = await https(request(app).post('/api/auth/login')).set('Cookie', xsrf).set('X-XSRF-TOKEN', token).send({ username, password });
    expect(login.status).toBe(200);
    const cookies = (login.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]!);
    const jar = [...cookies.filter((c) => !c.startsWith('XSRF-TOKEN=')), cookies.find((c) => c.startsWith('XSRF-TOKEN=')) ?? xsrf].join('; ');
    return { get: (url: string) => https(request(app).get(url)).set('Cookie', jar) };
  }

  it('has no products or protocol versions; a room gets "no protocol" (plan and checklist) and the setup checklist says what is missing', async () => {
    expect(await db('products').count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(await db('protocol_versions').count({ n: '*' })).toEqual([{ n: 0 }]);
    await createUser(db, { username: 'first-admin', password: 'first-admin-password', role: 'admin', displayName: 'First Admin' }, clock.now());
    const room = await createRoom(db, roomInputSchema.parse({ name: 'CT A', modality: 'CT', airChangesPerHour: 12 }), clock.now());
    const admin = await signInAs('first-admin', 'first-admin-password');

    const plan = await admin.get(`/api/days/${TODAY}/plan`);
    expect(plan.status).toBe(200);
    expect(plan.body.rooms[0]).toMatchObject({ id: room.id, protocol: null, message: 'No protocol for CT: set one up in Setup', gaps: [] });
    expect(plan.body.input.products).toEqual([]);
    expect(plan.body.input.protocols).toEqual({});

    const checklist = await admin.get(`/api/rooms/${room.id}/turnover?date=${TODAY}`);
    expect(checklist.status).toBe(409);
    expect(checklist.body.error).toMatchObject({ code: 'no_protocol', details: { modality: 'CT' } });

    const setup = await admin.get('/api/setup/checklist');
    expect(setup.body.complete).toBe(false);
    expect(setup.body.items.find((i: { key: string }) => i.key === 'protocols').missing).toEqual(['a protocol for CT (or a * fallback)']);
    expect(setup.body.items.find((i: { key: string }) => i.key === 'products').done).toBe(false);
  });
});

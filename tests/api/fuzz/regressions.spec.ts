import { signedIn, startHarness, type Client, type Harness } from '../harness';

/** Cases the fuzz suite found, kept as plain tests: each answered 500 before its fix. */
describe('fuzz findings', () => {
  let h: Harness;
  let admin: Client;

  beforeAll(async () => {
    h = await startHarness({ seedDay: true });
    admin = await signedIn(h.app, 'admin');
  }, 30_000);
  afterAll(() => h.close(), 30_000); // closes the app's worker pools too

  it('the last calendar day with a room open past midnight: 422, not 500 (its plan would end in year 10000)', async () => {
    const room = await admin.post('/api/rooms', { name: 'CT night', modality: 'CT', airChangesPerHour: 12, staff: 1, opensAt: '20:00', closesAt: '04:00' });
    expect(room.status).toBe(201);
    for (const path of ['plan', 'board', 'fixes', 'history']) {
      const res = await admin.get(`/api/days/9999-12-31/${path}`);
      expect([path, res.status, res.body.error?.code]).toEqual([path, 422, 'validation_failed']);
    }
    expect((await admin.get('/api/rooms/1/turnover?date=9999-12-31')).status).toBe(422);
    // the day before still has a plan
    expect((await admin.get('/api/days/9999-12-30/plan')).status).toBe(200);
  });
});

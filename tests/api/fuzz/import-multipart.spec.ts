import fc from 'fast-check';
import { exampleCsv } from '../../fixtures/exam-lists';
import type { Client } from '../harness';
import { DAY, startFuzzApp, type FuzzApp } from './fuzz-app';
import { fuzzOptions, fuzzTimeout } from './fuzz-runs';
import { expectSoundImport } from './import-check';
import { rawUpload } from './multipart';

/**
 * Multipart framing for `POST /api/days/:date/exams/import`: boundaries, missing headers, extra
 * fields, several files, cut bodies. Never a 5xx; a refusal leaves the day as it was; a 200
 * stores exactly the rows it reports.
 */
const RUNS = 200;

describe('fuzz: multipart shapes of an import', () => {
  let app: FuzzApp;
  let charge: Client;
  const statuses: Record<number, number> = {};

  beforeAll(async () => {
    app = await startFuzzApp();
    charge = app.clients.get('charge')!;
    // an empty day first, so that a first good file is a 200 and later ones change nothing
    await app.h.db('exams').where({ day: DAY }).delete();
  }, 30_000);
  afterAll(() => app.close(), 30_000);

  it('never a 5xx, a refusal changes nothing, a 200 stores what it reports', async () => {
    await fc.assert(
      fc.asyncProperty(rawUpload, fc.boolean(), async ({ contentType, body }, preview) => {
        const url = `/api/days/${DAY}/exams/import${preview ? '?dryRun=true' : ''}`;
        let test = charge.agent.post(url).set('X-XSRF-TOKEN', charge.token);
        if (contentType !== undefined) test = test.set('Content-Type', contentType);
        const what = `POST ${url} Content-Type: ${contentType} body ${JSON.stringify(body.subarray(0, 400).toString('latin1'))}`;
        const status = await expectSoundImport(app.h.db, test.send(body), what, app.lastError, { dryRun: preview });
        statuses[status] = (statuses[status] ?? 0) + 1;
      }),
      fuzzOptions(RUNS),
    );
    if (process.env['FUZZ_STATS']) process.stderr.write(`multipart statuses ${JSON.stringify(statuses)}\n`);
    // the generator must reach both a stored import and refusals, or it proves little
    expect(statuses[200]).toBeGreaterThan(0);
    expect(Object.keys(statuses).filter((s) => s.startsWith('4')).length).toBeGreaterThan(1);
  }, fuzzTimeout(RUNS));

  it('a good upload still imports after the fuzz (the server kept working)', async () => {
    const res = await charge.upload(`/api/days/${DAY}/exams/import`, exampleCsv(DAY), 'day.csv');
    expect(res.status).toBe(200);
  });
});

import type { Knex } from 'knex';
import { Client } from 'pg';
import { createDb } from '../../server/db';
import { startHarness, type Harness } from './harness';
import { testDatabaseUrl } from './pg-databases';

type Callback = (...answer: unknown[]) => void;

/**
 * A transaction is one connection: code that reads with `Promise.all` inside one hands pg several
 * queries at once, which pg 8 still queues but calls deprecated (pg 9 refuses). `createDb`
 * sends them one at a time. Runs with TEST_DATABASE_URL (npm run test:pg, CI).
 */
(testDatabaseUrl ? describe : describe.skip)('PostgreSQL connections: one query at a time', () => {
  let h: Harness;
  let db: Knex;
  /** The most queries one pg client had sent and not yet answered, at any moment. */
  let mostAtOnce = 0;
  beforeAll(async () => {
    h = await startHarness();
    const query = Client.prototype.query as unknown as (...args: unknown[]) => unknown;
    const waiting = new Map<Client, number>();
    jest.spyOn(Client.prototype, 'query').mockImplementation(function (this: Client, ...args: unknown[]) {
      const callback = args[1];
      if (typeof callback === 'function') {
        waiting.set(this, (waiting.get(this) ?? 0) + 1);
        mostAtOnce = Math.max(mostAtOnce, waiting.get(this)!);
        args[1] = (...answer: unknown[]) => {
          waiting.set(this, waiting.get(this)! - 1);
          (callback as Callback)(...answer);
        };
      }
      return query.apply(this, args);
    } as never);
    // a pool of its own, whose connections are made after the spy
    db = createDb(h.file);
  }, 30_000);
  afterAll(async () => {
    jest.restoreAllMocks();
    await db.destroy();
    await h.close();
  }, 30_000);

  it('sends the concurrent queries of one transaction in turn, each getting its own answer', async () => {
    mostAtOnce = 0;
    const answers = await db.transaction((trx) =>
      Promise.all([1, 2, 3, 4].map((n) => trx.raw('select ?::int as n, pg_sleep(0.01)', [n]).then((r: { rows: { n: number }[] }) => r.rows[0]!.n))),
    );
    expect(answers).toEqual([1, 2, 3, 4]);
    expect(mostAtOnce).toBe(1);
  });

  it('gives a failing query its error and still sends the query behind it', async () => {
    const [failed, next] = await db.transaction((trx) => Promise.allSettled([trx.raw('select no_such_column from settings'), trx.raw('select 2 as n')]));
    expect(failed).toMatchObject({ status: 'rejected', reason: { message: expect.stringMatching(/no_such_column/) } });
    // PostgreSQL refuses the rest of a transaction after an error: the query behind it was sent and answered
    expect(next).toMatchObject({ status: 'rejected', reason: { message: expect.stringMatching(/current transaction is aborted/) } });
    expect((await db.raw('select 3 as n')).rows[0].n).toBe(3);
  });
});

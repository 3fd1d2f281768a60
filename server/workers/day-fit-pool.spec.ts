import { smallDay } from '../../shared/day-fit/testing/small-days';
import { createDayFitPool, type DayFitPool } from './day-fit-pool';

describe('createDayFitPool', () => {
  let pool: DayFitPool;
  beforeAll(() => {
    pool = createDayFitPool({ solveMs: 20_000 });
  });
  afterAll(() => pool.close(), 30_000);

  it('solves a day and version once when asked twice at the same time, and answers it again from the last answers', async () => {
    const { input, fixed } = smallDay(3, 15);
    const [a, b] = await Promise.all([pool.propose('2027-03-16@1/1', { input, options: { fixed } }), pool.propose('2027-03-16@1/1', { input, options: { fixed } })]);
    expect(a).toBe(b); // one solve's answer, shared
    expect(await pool.propose('2027-03-16@1/1', { input, options: { fixed } })).toBe(a);
    const other = await pool.propose('2027-03-16@2/1', { input, options: { fixed } });
    expect(other).not.toBe(a); // another version is solved again
    expect(other.objective).toEqual(a.objective);
  }, 60_000);
});

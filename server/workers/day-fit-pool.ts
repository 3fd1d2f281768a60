import type { DayFitProposal } from '../../shared/day-fit';
import { HttpError } from '../errors';
import type { DayFitTask } from './day-fit-task';
import { createThreadPool, poolFailure } from './thread-pool';

const RECENT_ANSWERS = 8;

/** The solver's budget for one proposal unless the pool is told otherwise. */
export const DAY_FIT_SOLVE_MS = 8_000;

/**
 * On a roster day planned in rounds, the budget per gap the roster finds short (within the
 * budget above): on the bench's invented 80-exam roster days, 300 ms a gap left as many gaps as
 * the whole 8 s did, in 50–70 % of the time (measured, `npm run bench`).
 */
export const ROSTER_MS_PER_GAP = 300;

export interface DayFitPoolOptions {
  /** Threads at most; default 1, leaving the other core of a small server to the event loop. */
  maxThreads?: number;
  /** Days waiting for a thread before new ones are turned away with 503; default 4. */
  maxQueue?: number;
  /** The solver's own budget; the thread is given up 20 s after it. Default 8 s. */
  solveMs?: number;
}

/** Whole-day proposals computed in a worker thread, one solve per day and version at a time. */
export interface DayFitPool {
  /**
   * The proposal for `key` (the day and the versions of the day and the setup): a call for a key
   * already being solved shares that solve, and one of the last few answered gets that answer.
   */
  propose(key: string, task: DayFitTask): Promise<DayFitProposal>;
  close(): Promise<void>;
}

/**
 * A one-thread pool for "make the day fit" (created in `createApp`). Its own pool, so a long
 * solve never delays an upload or a suggestion; a second request for a day and version already
 * being solved waits for that solve instead of starting another.
 *
 * @example
 * const pool = createDayFitPool();
 * const proposal = await pool.propose('2027-03-16@12', { input, options: { fixed } });
 */
export function createDayFitPool(options: DayFitPoolOptions = {}): DayFitPool {
  const pool = createThreadPool({
    entry: 'day-fit-worker.cjs',
    maxThreads: options.maxThreads,
    maxQueue: options.maxQueue ?? 4,
    maxHeapMb: 512,
    idleTimeoutMs: 60_000,
  });
  const solveMs = options.solveMs ?? DAY_FIT_SOLVE_MS;
  const running = new Map<string, Promise<DayFitProposal>>();
  // The last few answers: the same day at the same versions gets the same proposal again at once.
  const recent = new Map<string, DayFitProposal>();
  return {
    propose(key, task) {
      const done = recent.get(key);
      if (done) return Promise.resolve(done);
      let solve = running.get(key);
      if (!solve) {
        solve = pool
          .run<DayFitProposal>('dayFitTask', { ...task, options: { timeLimitMs: solveMs, ...task.options } }, (task.options.timeLimitMs ?? solveMs) + 20_000)
          .catch((error: unknown) => {
            throw poolFailure(error) === null ? error : busy();
          })
          .then((proposal) => {
            if (recent.size >= RECENT_ANSWERS) recent.delete(recent.keys().next().value!);
            recent.set(key, proposal);
            return proposal;
          })
          .finally(() => running.delete(key));
        running.set(key, solve);
      }
      return solve;
    },
    close: () => pool.close(),
  };
}

function busy(): HttpError {
  return new HttpError(503, 'busy', 'The server is busy making a day fit. Try again in a moment.');
}

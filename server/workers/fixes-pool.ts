import type { Fix } from '../../shared/fixes';
import { HttpError } from '../errors';
import type { FixesPageTask, GapFixesTask } from './fixes-task';
import { createThreadPool, poolFailure } from './thread-pool';

export interface FixesPoolOptions {
  /** Threads at most; default 1, leaving the other core of a small server to the event loop. */
  maxThreads?: number;
  /** Calls waiting for a thread before new ones are turned away with 503; default 16. */
  maxQueue?: number;
  /** A call that takes longer is given up with 503; default 30 s (a bounded call takes well under one). */
  timeoutMs?: number;
}

/** Suggested fixes computed in worker threads, never on the event loop. */
export interface FixesPool {
  /** One page of the day's fixes, as JSON; null when `after` is not an exam of the day. */
  page(task: FixesPageTask): Promise<string | null>;
  /** The fixes of one gap; null when `toExamId` is not an exam of the day. */
  gap(task: GapFixesTask): Promise<Fix[] | null>;
  close(): Promise<void>;
}

/**
 * A small pool of worker threads for suggested fixes, one per app (created in `createApp`).
 * Threads start on demand and end after half a minute idle (keeping the engine's memoised
 * turnovers warm between clicks); an idle thread never holds the process open.
 *
 * @example
 * const pool = createFixesPool();
 * const fixes = await pool.gap({ input, toExamId: 12 });
 * await pool.close();
 */
export function createFixesPool(options: FixesPoolOptions = {}): FixesPool {
  const pool = createThreadPool({
    entry: 'fixes-worker.cjs',
    maxThreads: options.maxThreads,
    maxQueue: options.maxQueue ?? 16,
    maxHeapMb: 256,
    idleTimeoutMs: 30_000,
  });
  const timeoutMs = options.timeoutMs ?? 30_000;
  const run = async <T>(task: object, name: string): Promise<T> => {
    try {
      return await pool.run<T>(name, task, timeoutMs);
    } catch (error) {
      throw poolFailure(error) === null ? error : busy();
    }
  };
  return {
    page: (task) => run(task, 'fixesPageTask'),
    gap: (task) => run(task, 'gapFixesTask'),
    close: () => pool.close(),
  };
}

function busy(): HttpError {
  return new HttpError(503, 'busy', 'The server is busy working out suggestions. Try again in a moment.');
}

import path from 'node:path';
import Piscina from 'piscina';

export interface ThreadPoolOptions {
  /** The worker entry beside this file (a `.cjs` that registers tsx and loads its tasks). */
  entry: string;
  /** Threads at most; default 1, leaving the other core of a small server to the event loop. */
  maxThreads?: number;
  /** Tasks waiting for a thread; past that a run is refused (`isQueueFull`). */
  maxQueue: number;
  /** Heap of one worker: a task that needs more ends its worker, never the server. */
  maxHeapMb: number;
  /** How long an idle thread lives; threads start on demand, so an idle server holds none. */
  idleTimeoutMs: number;
}

/** A bounded pool of worker threads running named tasks, each within a time limit. */
export interface ThreadPool {
  run<T>(name: string, task: object, timeoutMs: number): Promise<T>;
  close(): Promise<void>;
}

/**
 * A piscina pool for work that grows with its input. Each app makes its own pools (uploads and
 * suggested fixes apart, so a slow file never delays a suggestion) and `closeApp` ends them.
 *
 * @example
 * const pool = createThreadPool({ entry: 'worker.cjs', maxQueue: 8, maxHeapMb: 384, idleTimeoutMs: 1000 });
 * const result = await pool.run('readExamListTask', task, 15_000);
 */
export function createThreadPool(options: ThreadPoolOptions): ThreadPool {
  const pool = new Piscina({
    filename: path.join(__dirname, options.entry),
    minThreads: 0,
    maxThreads: options.maxThreads ?? 1,
    idleTimeout: options.idleTimeoutMs,
    maxQueue: options.maxQueue,
    resourceLimits: { maxOldGenerationSizeMb: options.maxHeapMb, maxYoungGenerationSizeMb: 32 },
  });
  return {
    run: (name, task, timeoutMs) => pool.run(task, { name, signal: AbortSignal.timeout(timeoutMs) }),
    close: () => pool.destroy(),
  };
}

/** Why a run failed, as far as the pool is concerned: too slow, out of memory, or queue full. */
export function poolFailure(error: unknown): 'timeout' | 'memory' | 'queue-full' | null {
  const { name, code, message } = error as { name?: string; code?: string; message?: string };
  if (name === 'AbortError') return 'timeout';
  if (code === 'ERR_WORKER_OUT_OF_MEMORY') return 'memory';
  if (message === 'Task queue is at limit') return 'queue-full';
  return null;
}

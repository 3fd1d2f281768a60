import path from 'node:path';
import Piscina from 'piscina';
import { HttpError } from '../errors';
import { FileLimitError } from '../services/file-limits';
import type { ExamListTask, ExamListTaskResult } from './exam-list-task';
import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';

export interface WorkerPoolOptions {
  /** Threads at most; default 1, leaving the other core of a small server to the event loop. */
  maxThreads?: number;
  /** Tasks waiting for a thread before new ones are turned away with 503. */
  maxQueue?: number;
  /** Heap of one worker; a file that needs more ends that worker only, never the server. */
  maxHeapMb?: number;
}

/** Work that grows with its input and so runs in worker threads, never on the event loop. */
export interface WorkerPool {
  readExamList(task: ExamListTask): Promise<ExamListTaskResult>;
  close(): Promise<void>;
}

/**
 * A pool of worker threads with bounded memory, time and queue. Threads start on demand and
 * end after a second idle, so an idle server (or a finished test) holds none.
 *
 * @example
 * const pool = createWorkerPool();
 * const result = await pool.readExamList(task);
 * await pool.close();
 */
export function createWorkerPool(options: WorkerPoolOptions = {}): WorkerPool {
  const pool = new Piscina({
    filename: path.join(__dirname, 'worker.cjs'),
    minThreads: 0,
    maxThreads: options.maxThreads ?? 1,
    idleTimeout: 1000,
    maxQueue: options.maxQueue ?? 8,
    resourceLimits: { maxOldGenerationSizeMb: options.maxHeapMb ?? 384, maxYoungGenerationSizeMb: 32 },
  });
  return {
    async readExamList(task) {
      try {
        return await pool.run(task, { name: 'readExamListTask', signal: AbortSignal.timeout(EXAM_FILE_LIMITS.maxReadSeconds * 1000) });
      } catch (error) {
        throw refusalFor(error);
      }
    },
    close: () => pool.destroy(),
  };
}

function refusalFor(error: unknown): unknown {
  const { name, code, message } = error as { name?: string; code?: string; message?: string };
  if (name === 'AbortError') return FileLimitError.slow();
  if (code === 'ERR_WORKER_OUT_OF_MEMORY') return FileLimitError.memory();
  if (message === 'Task queue is at limit') {
    return new HttpError(503, 'busy', 'The server is reading other files right now. Try again in a moment.');
  }
  return error;
}

import { EXAM_FILE_LIMITS } from '../../shared/exam-list/file-limits';
import { HttpError } from '../errors';
import { FileLimitError } from '../services/file-limits';
import type { ExamListTask, ExamListTaskResult } from './exam-list-task';
import { createThreadPool, poolFailure } from './thread-pool';

export interface WorkerPoolOptions {
  maxThreads?: number;
  /** Files waiting for a thread before new ones are turned away with 503; default 8. */
  maxQueue?: number;
  /** Heap of one worker; a file that needs more ends that worker only, never the server. */
  maxHeapMb?: number;
}

/** Reading uploaded files, which grows with the file, in worker threads, never on the event loop. */
export interface WorkerPool {
  readExamList(task: ExamListTask): Promise<ExamListTaskResult>;
  close(): Promise<void>;
}

/**
 * The upload pool: bounded memory, time and queue; threads end after a second idle.
 *
 * @example
 * const pool = createWorkerPool();
 * const result = await pool.readExamList(task);
 * await pool.close();
 */
export function createWorkerPool(options: WorkerPoolOptions = {}): WorkerPool {
  const pool = createThreadPool({
    entry: 'worker.cjs',
    maxThreads: options.maxThreads,
    maxQueue: options.maxQueue ?? 8,
    maxHeapMb: options.maxHeapMb ?? 384,
    idleTimeoutMs: 1000,
  });
  return {
    async readExamList(task) {
      try {
        return await pool.run<ExamListTaskResult>('readExamListTask', task, EXAM_FILE_LIMITS.maxReadSeconds * 1000);
      } catch (error) {
        throw refusalFor(error);
      }
    },
    close: () => pool.close(),
  };
}

function refusalFor(error: unknown): unknown {
  switch (poolFailure(error)) {
    case 'timeout':
      return FileLimitError.slow();
    case 'memory':
      return FileLimitError.memory();
    case 'queue-full':
      return new HttpError(503, 'busy', 'The server is reading other files right now. Try again in a moment.');
    default:
      return error;
  }
}

import { parseExamTable, type ExamListResult } from '../../shared/exam-list';
import { HttpError } from '../errors';
import type { ErrorCode } from '../../shared/api/errors';
import { readExamFile } from '../services/exam-file';

/** What the worker needs to read and check an uploaded day list. */
export interface ExamListTask {
  bytes: Uint8Array;
  originalname: string;
  mimetype: string;
  date: string;
  timezone: string;
  roomNames: string[];
}

/** The rows of a read file (or its problems), or the refusal to rethrow on the main thread. */
export type ExamListTaskResult =
  | { ok: true; parsed: ExamListResult; table: string[][] }
  | { ok: false; refusal: { status: number; code: ErrorCode; message: string; details?: unknown; extra?: Record<string, unknown> } };

const PREVIEW_TABLE_ROWS = 1000;

/**
 * Reads the file and checks every row, in a worker thread: both grow with the file, so they
 * stay off the event loop. Typed errors do not survive the thread boundary, so a refusal comes
 * back as data; anything unexpected is thrown and the pool reports it.
 *
 * @example
 * const result = await readExamListTask({ bytes, originalname: 'day.csv', mimetype: 'text/csv', date, timezone, roomNames });
 */
export async function readExamListTask(task: ExamListTask): Promise<ExamListTaskResult> {
  try {
    const buffer = Buffer.from(task.bytes.buffer, task.bytes.byteOffset, task.bytes.byteLength);
    const table = await readExamFile({ buffer, originalname: task.originalname, mimetype: task.mimetype });
    const parsed = parseExamTable(table, { date: task.date, timezone: task.timezone, roomNames: task.roomNames });
    // The preview only needs the table when there are errors to mark in it.
    return { ok: true, parsed, table: parsed.errors.length > 0 ? table.slice(0, PREVIEW_TABLE_ROWS) : [] };
  } catch (error) {
    if (!(error instanceof HttpError)) throw error;
    return { ok: false, refusal: { status: error.status, code: error.code, message: error.message, details: error.details, extra: error.extra } };
  }
}

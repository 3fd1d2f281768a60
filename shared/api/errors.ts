/**
 * Every refusal the server sends, by `code`, with its HTTP status and the `details` it carries.
 * The client decides what happened from `code` and `details`, never from the English `message`
 * (which is for people and may be reworded). The README's error table lists the same codes.
 */

/** One field-level problem of a refused request (`details.problems`). */
export interface Problem {
  field: string;
  message: string;
}

/** One problem of an imported file, by row and column (the import refusal's top-level `errors`). */
export interface RowProblem {
  row: number;
  column: string;
  message: string;
}

/** Who last changed a slot, as a stale move or staffing change reports it. */
export interface ChangedBy {
  username: string;
  displayName: string;
  at: string;
  summary: string;
}

/**
 * The `details` of each code (`undefined`: the code carries none). Adding a code here makes the
 * server able to send it ({@link ERROR_STATUS} needs its status too) and the client able to test for it.
 */
export interface ErrorDetails {
  /** 400: the request could not be read (a library refused it before our code saw it). */
  bad_request: undefined;
  /** 400: the body is not valid JSON. */
  bad_json: undefined;
  /** 400: the multipart upload is malformed (not one file in the field `file`). */
  bad_upload: undefined;
  /** 401: not signed in, or the session ended. */
  unauthorized: undefined;
  /** 403: the role may not do this. */
  forbidden: undefined;
  /** 403: the double-submit XSRF pair is missing or out of date. */
  xsrf_failed: undefined;
  /** 404: no such thing (exam, room, turnover, step, log entry, route), or not in demo mode. */
  not_found: undefined;
  /** 409: a move or staffing change sent an old `version`; someone (or an import) changed the slot first. */
  stale_version: { currentVersion: number; changedBy: ChangedBy | null };
  /** 409: an import commit whose day changed since its preview; nothing was imported. */
  day_changed: { previewedVersion: number; currentVersion: number };
  /** 409: undo with no action of one's own left to undo on the day. */
  nothing_to_undo: undefined;
  /** 409: redo with nothing undone (or a new action made since the undo). */
  nothing_to_redo: undefined;
  /** 409: undo, redo or a fix found a slot, a staffing or the day's roster (`rosterDay`) changed since the action it reverts or applies. */
  changed_since: { accession: string; examId: number } | { rosterDay: string };
  /** 409: the suggested fix no longer applies (the day changed, or an exam it moves arrived or came due); the gap's fixes were recomputed. */
  fix_stale: undefined;
  /** 409: a "make the day fit" proposal computed on an older version of the day; nothing applied. */
  fit_stale: { proposedVersion: number; currentVersion: number };
  /** 409: already recorded: a step ticked, an exam's end, a shift task ticked off (`at`: when). */
  already_done: { at: string; by?: string };
  /** 409: the turnover was completed; corrections go to the log. */
  turnover_complete: { completedAt: string };
  /** 409: the exam before this turnover was moved out of the room since. */
  turnover_moved: undefined;
  /** 409: the exam's end is recorded (its turnover has begun), so it can no longer be moved, edited or cancelled. */
  exam_finished: { endedAt: string };
  /** 413: the request body or the file is larger than allowed. */
  payload_too_large: undefined;
  /** 413 (bytes) or 422 (rows, cells, unpacked size): an exam file over one of its limits. */
  file_limit_exceeded: { limit: string; max: number; row?: number };
  /**
   * 415 (not CSV/XLSX, old .xls, binary) or 422 (empty, no exams, not UTF-8, unreadable CSV or
   * workbook): the file as a whole cannot be read. An unreadable CSV lists where in `errors`.
   */
  file_refused: undefined;
  /**
   * 422: invalid input; `details.problems` names the fields. An import refused for its rows
   * answers `errors` (row, column, message: the first 200), `errorCount`, `warnings`, `table`
   * at the top level instead.
   */
  validation_failed: { problems: Problem[] } | undefined;
  /** 422: a move to a room of another modality. */
  other_modality: { examModality: string; roomModality: string };
  /** 422: a move that would put the exam (start or end) outside its day, in site time. */
  outside_day: { day: string; timezone: string };
  /** 422: "exam finished" before the slot's start without an `earlyReason`. */
  exam_not_started: { start: string; problems: Problem[] };
  /** 422: steps not done yet: every step (complete) or the ones this step needs first (tick). */
  steps_missing: { missing: string[]; problems: Problem[] };
  /** 422: a surface is still wet (contact time); pass `earlyReason` / `overrideReason`. */
  surface_wet: { wet: string[]; wetUntil: string; problems: Problem[] };
  /** 422: the airborne-precaution air hold is not over (`until`); pass `overrideReason`. Surfaces still wet are in `wet`. */
  air_hold: { until: string; airHoldUntil: string; wet: string[]; problems: Problem[] };
  /** 422: the fix would leave other gaps short or overlapping; send `acceptNewProblems`. */
  fix_has_new_problems: { newProblems: number };
  /** 403: the user's password was reset; only the profile's password change (and sign-out) is allowed until it is changed. */
  password_change_required: undefined;
  /** 409: the change would leave no active admin (deactivate or demote the last one). */
  last_admin: undefined;
  /** 409: a room with exams booked today or later cannot be retired (`count` of them, the first `day`). */
  room_has_exams: { count: number; firstDay: string };
  /** 422: MR Unsafe or unmarked items in an MR room's kit (ASTM F2503; ACR Zone IV); `items` names them. */
  kit_not_mr_safe: { items: { id: number; name: string; marking: string }[]; problems: Problem[] };
  /** 409: the room's modality has no protocol (nor a `*` fallback) on that day: no checklist to show. */
  no_protocol: { modality: string };
  /** 409: a product used by a current or future protocol version cannot be retired; `modalities` name them. */
  product_in_use: { modalities: string[] };
  /** 429: too many failed sign-ins; wait 15 minutes. */
  too_many_attempts: undefined;
  /** 500: an unexpected failure, logged on the server; never a stack trace. */
  internal: undefined;
  /** 503: too much work queued (file reading, suggestions); try again in a moment. */
  busy: undefined;
}

/** Every `code` the server sends. */
export type ErrorCode = keyof ErrorDetails;

/** The usual status of each code (`file_limit_exceeded` and `file_refused` also answer 422, see above). */
export const ERROR_STATUS: { readonly [C in ErrorCode]: number } = {
  bad_request: 400,
  bad_json: 400,
  bad_upload: 400,
  unauthorized: 401,
  forbidden: 403,
  xsrf_failed: 403,
  not_found: 404,
  stale_version: 409,
  day_changed: 409,
  nothing_to_undo: 409,
  nothing_to_redo: 409,
  changed_since: 409,
  fix_stale: 409,
  fit_stale: 409,
  already_done: 409,
  turnover_complete: 409,
  turnover_moved: 409,
  exam_finished: 409,
  payload_too_large: 413,
  file_limit_exceeded: 413,
  file_refused: 415,
  validation_failed: 422,
  other_modality: 422,
  outside_day: 422,
  exam_not_started: 422,
  steps_missing: 422,
  surface_wet: 422,
  air_hold: 422,
  fix_has_new_problems: 422,
  password_change_required: 403,
  last_admin: 409,
  room_has_exams: 409,
  kit_not_mr_safe: 422,
  no_protocol: 409,
  product_in_use: 409,
  too_many_attempts: 429,
  internal: 500,
  busy: 503,
};

/** The JSON body of every error answer, as the server sends it. */
export interface ErrorBody<C extends ErrorCode = ErrorCode> {
  error: { code: C; message: string; details?: ErrorDetails[C] };
}

/** The import refusal for bad rows: `validation_failed` plus the rows' problems and the file's cells. */
export interface ImportRefusalBody extends ErrorBody<'validation_failed'> {
  errors: RowProblem[];
  errorCount: number;
  warnings: unknown[];
  table: unknown;
}

/**
 * The one error shape the client works with. The server answers failures as
 * `{error: {code, message, details?}}` with an HTTP status; the client's error interceptor folds the
 * status in, so components never look at raw HTTP responses.
 */
export interface ApiError {
  /** HTTP status; 0 when the server could not be reached at all. */
  status: number;
  /** An {@link ErrorCode} from the server, or one the client makes up when there was no JSON answer. */
  code: string;
  /** Human-readable text, safe to show as is; never parsed. */
  message: string;
  /** What the code says it carries (see {@link ErrorDetails}). */
  details?: unknown;
}

/**
 * Tells an {@link ApiError} apart from any other thrown value (a bug, a cancelled request).
 *
 * @example
 * isApiError({ status: 409, code: 'stale_version', message: 'Someone moved this slot first.' }); // true
 * isApiError(new Error('boom')); // false
 */
export function isApiError(value: unknown): value is ApiError {
  if (typeof value !== 'object' || value === null) return false;
  const candidate = value as Partial<ApiError>;
  return (
    typeof candidate.status === 'number' &&
    typeof candidate.code === 'string' &&
    typeof candidate.message === 'string'
  );
}

/**
 * Narrows an error to one code, typing its `details`.
 *
 * @example
 * if (hasErrorCode(error, 'surface_wet')) showWet(error.details.wet);
 * hasErrorCode({ status: 409, code: 'nothing_to_undo', message: '…' }, 'nothing_to_undo'); // true
 */
export function hasErrorCode<C extends ErrorCode>(value: unknown, code: C): value is ApiError & { code: C; details: ErrorDetails[C] } {
  return isApiError(value) && value.code === code;
}

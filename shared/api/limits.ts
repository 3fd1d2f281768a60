/**
 * Every limit and list of allowed values the API checks, in one place: the zod schemas, the
 * server, the client's controls and the README all read them from here.
 */

/**
 * People on one turnover: a room's usual staff and a single turnover's override alike (rooms
 * once allowed 4, the staffing routes 3: one limit now). The engine plans any number; its
 * exhaustive check (solver-exhaustive.spec.ts) covers 1–3, and the Day plan offers 1–3.
 */
export const TURNOVER_STAFF = { min: 1, max: 3 } as const;

/** A room's measured air changes per hour (the airborne hold time depends on it). */
export const AIR_CHANGES_PER_HOUR = { min: 1, max: 60 } as const;

/** Characters in a room's name (it labels a lane on the plan and a card on the board). */
export const ROOM_NAME_MAX = 40;

/**
 * Characters in a reason or note a person types: why a step is ticked while wet, why an exam is
 * finished before its slot, why a turnover closes early, a cleaning log correction.
 */
export const NOTE_MAX_CHARS = 500;

/** Minutes above the required time within which a gap is `snug` rather than `fits`. */
export const SNUG_MARGIN_MINUTES = { min: 0, max: 60 } as const;

/** Why a slot moved, as a move request may say: the history shows it. */
export const MOVE_REASONS = ['drag', 'keyboard', 'api'] as const;
export type MoveReason = (typeof MOVE_REASONS)[number];

/**
 * Why a day's plan changed: a move's reason, or an action that is not a single move. `hl7`: a
 * message from the booking system's HL7 feed (a booking, reschedule, change or cancellation).
 * `roster`: the day's roster saved or returned to the weekly default. `day fit`: a "make the day fit" proposal applied.
 */
export const CHANGE_REASONS = [...MOVE_REASONS, 'suggestion', 'undo', 'redo', 'staffing', 'exam added', 'exam edited', 'exam cancelled', 'hl7', 'roster', 'day fit'] as const;
export type ChangeReason = (typeof CHANGE_REASONS)[number];

/** Days one report may cover (a quarter): its work grows with the range, so the range is capped. */
export const REPORT_MAX_DAYS = 92;

/**
 * "Make the day fit": the whole-day proposal's input and answer. Framework-free; the MIP is
 * written here as CPLEX LP text and handed to a solver the caller supplies (the server runs
 * HiGHS in a worker thread), so this folder never loads WebAssembly itself.
 */
import type { PlanChange } from '../api/changes';
import type { PlanSummary, Verdict } from '../api/plan';

/** Why an exam may not move: `passed` is an exam of today whose start time has come. */
export const FIXED_REASONS = ['arrived', 'started', 'pinned', 'passed'] as const;
export type FixedReason = (typeof FIXED_REASONS)[number];

/**
 * A spare person who may join a turnover as its helper (one more person than the room's staff)
 * while free. Without a roster the list is empty and no helper is proposed.
 */
export interface FitHelper {
  /** Stable within the day (the roster's person id). */
  id: string;
  label: string;
  /** Local `HH:MM` intervals the person is free, end after start, on the day. */
  free: readonly { start: string; end: string }[];
  /** Rooms the person covers; null: any room. */
  roomIds: readonly number[] | null;
}

/** The answer of one MIP solve, whatever solver ran it. */
export interface MipResult {
  status: 'optimal' | 'time-limit' | 'infeasible' | 'error';
  /** Values by variable name; null when no feasible point was found. */
  values: ReadonlyMap<string, number> | null;
  /** Relative gap between the best point and the best bound (0 when optimal; 1 when unknown). */
  mipGap: number;
}

/** Solves an LP-format model (minimise) within `timeLimitSeconds`. */
export type MipSolve = (lp: string, timeLimitSeconds: number) => MipResult;

export interface DayFitOptions {
  /** Exams that must not move, with the reason. */
  fixed?: Readonly<Record<number, FixedReason>>;
  /**
   * No exam starts before this instant (ms since the epoch) unless it already did: on today, now
   * (a patient cannot be called to a time gone by); an exam whose start is earlier stays where it
   * is (`passed`). None by default.
   */
  notBefore?: number;
  /** Spare people from the roster; none by default. */
  helpers?: readonly FitHelper[];
  /** Minutes a helper needs between two turnovers (walking). Default 0. */
  walkingMinutes?: number;
  /** Wall-clock budget for all solves; default 8 s. */
  timeLimitMs?: number;
  /**
   * On a day with a roster planned in rounds: the budget is at most this many ms per gap the
   * roster finds short before (at least `ROSTER_LEAST_MS`, never more than `timeLimitMs`), so a
   * day with a few problems is not kept waiting for the whole limit. None by default.
   */
  rosterMsPerGap?: number;
  /**
   * Starts only on multiples of this many minutes after the site's midnight (tests compare with
   * an enumeration on the same grid). Default 1: whole minutes.
   */
  gridMinutes?: number;
  /** A modality group with at most this many exams is solved whole (exact); larger ones by neighbourhoods. Default 12. */
  wholeGroupLimit?: number;
  /**
   * When the crew of the turnover into an exam can start at the earliest, by the exam's id and
   * the room's, in ms since the epoch: a person busy in another room, on a break or not yet on
   * shift. Every turnover into the exam in that room starts no earlier, whatever goes before it.
   * Set by `proposeWithRoster`; none by default.
   */
  crewFrom?: Readonly<Record<number, Readonly<Record<number, number>>>>;
  /** Exams whose gap before them counts as a problem to clear although the engine alone finds it fits (a roster's judgement). */
  problems?: readonly number[];
  /**
   * On a day with a roster: a part of the day (rooms that share people) with at most this many
   * exams is solved exactly with the roster's people in the MIP; larger ones are planned in
   * rounds. Default `ROSTER_EXACT_LIMIT` (8); 0 always plans in rounds.
   */
  rosterExactLimit?: number;
  /**
   * On a roster day solved exactly: may a turnover get one person more than its room's staff
   * from the roster's people (a helper, as a staffing change)? Default true. (Planned in rounds,
   * helpers come from `helpers`.)
   */
  helpersFromRoster?: boolean;
  /** On a roster day planned in rounds: try the gaps they leave window by window with the roster's people. Default true. */
  rosterWindows?: boolean;
  /** A large group's neighbourhoods: how many of the widening reaches to try (default all four). */
  reaches?: number;
  /** Clock for the budget; default Date.now. */
  now?: () => number;
}

export type FitChangeKind = 'shift' | 'other-room' | 'helper' | 'isolation-last';

/** One exam's place before and after. */
export interface FitExamMove {
  examId: number;
  accession: string;
  kind: FitChangeKind;
  from: { roomId: number; start: string };
  to: { roomId: number; start: string };
  /** |new start − old start| in real minutes. */
  minutesMoved: number;
}

/** A patient to call: their exam starts at another time. */
export interface FitCall {
  examId: number;
  accession: string;
  fromStart: string;
  toStart: string;
  fromRoomId: number;
  toRoomId: number;
}

export interface FitHelperUse {
  toExamId: number;
  accession: string;
  helperId: string;
  label: string;
  /** People on the turnover before and after (the room's staff or a set value, then one more). */
  staffFrom: number;
  staffTo: number;
  roomId: number;
  /** When the person is booked for it: the longest turnover that could precede the exam, ending at its start. */
  busyFrom: string;
  busyTo: string;
}

/** A gap still `short` or `overlap` after the proposal, and why. */
export interface FitRemainingGap {
  fromExamId: number | null;
  toExamId: number;
  accession: string;
  roomId: number;
  verdict: Verdict;
  shortByMinutes: number;
  reason: string;
}

export interface FitSolverReport {
  /** `optimal`: every solve proved optimal; `time-limit`: some solve stopped at the limit with a point. */
  status: 'optimal' | 'time-limit' | 'nothing-to-do';
  /** Largest relative MIP gap of the solves (0 when all proved optimal). */
  mipGap: number;
  /** `whole`: each group solved whole; `neighbourhood`: a large group solved around its problem gaps. */
  scope: 'whole' | 'neighbourhood';
  solves: number;
  clusters: number;
  milliseconds: number;
  /**
   * On a day with a roster: `exact` when the day was solved with the roster's people in the MIP
   * (a small day: proven the best when `status` is `optimal`), `rounds` when planned in rounds
   * around it (not proven the best).
   */
  roster?: 'exact' | 'rounds';
  /** On a day with a roster planned in rounds: how many (see `proposeWithRoster`). */
  rosterRounds?: number;
  /** Windows after the rounds, solved with the roster's people, that made the day better (`improveInWindows`). */
  rosterWindows?: number;
  /** Pushes of exams along their room after the rounds that made the day better (`pushAlongRooms`). */
  rosterPushes?: number;
  /** Exams the proposal had moved that were then put back, all the way or half-way, as the day did not need it (`settleBack`). */
  rosterReturned?: number;
}

export interface DayFitProposal {
  date: string;
  /** The PlanChange list that applies the proposal (moves, then helpers). */
  changes: PlanChange[];
  moves: FitExamMove[];
  calls: FitCall[];
  helpers: FitHelperUse[];
  remaining: FitRemainingGap[];
  objective: { gapsLeft: number; examsMoved: number; minutesMoved: number; dayEndsAt: string | null; helpersAdded: number };
  before: PlanSummary;
  after: PlanSummary;
  solver: FitSolverReport;
}

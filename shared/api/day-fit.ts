import { z } from 'zod';
import type { DayFitProposal, FixedReason } from '../day-fit/model';
import { TURNOVER_STAFF } from './limits';

export type { DayFitProposal, FitCall, FitExamMove, FitHelperUse, FitRemainingGap, FitSolverReport } from '../day-fit/model';

/** `POST /api/days/:date/fit`: the proposal, the day version it was computed on and who may not move. */
export interface DayFitAnswer extends DayFitProposal {
  dayVersion: number;
  /** Exams that stayed put because they may not move, with why. */
  fixed: { examId: number; accession: string; reason: FixedReason }[];
}

/** Most changes one proposal may carry (a 1,200-exam day moves far fewer). */
export const MAX_FIT_CHANGES = 2400;

const place = z.object({ roomId: z.number().int().positive(), start: z.string().datetime({ offset: true }) });

/** `POST /api/days/:date/fit/apply` body: the proposal's changes and the day version it was computed on. */
export const dayFitApplySchema = z.object({
  dayVersion: z.number().int().min(0),
  changes: z
    .array(
      z.discriminatedUnion('type', [
        z.object({ type: z.literal('move'), examId: z.number().int().positive(), accession: z.string().max(64), from: place, to: place }),
        z.object({
          type: z.literal('staffing'),
          toExamId: z.number().int().positive(),
          accession: z.string().max(64),
          from: z.number().int().min(TURNOVER_STAFF.min).max(TURNOVER_STAFF.max).nullable(),
          to: z.number().int().min(TURNOVER_STAFF.min).max(TURNOVER_STAFF.max).nullable(),
        }),
      ]),
    )
    .min(1)
    .max(MAX_FIT_CHANGES),
});
export type DayFitApplyInput = z.infer<typeof dayFitApplySchema>;

/** `PUT /api/exams/:id/pin` body. */
export const examPinSchema = z.object({ pinned: z.boolean() });

import { z } from 'zod';
import { ruleProblems } from '../shift-tasks/rule-check';

export const SHIFT_TASK_LABEL_MAX = 120;
export const SHIFT_TASK_RULE_MAX = 500;
/** Minutes a task takes; a deep clean of an hour or two is the longest we expect. */
export const SHIFT_TASK_MINUTES = { min: 1, max: 240 } as const;

const taskFields = {
  label: z.string().trim().min(1, 'a task needs a name').max(SHIFT_TASK_LABEL_MAX, `use at most ${SHIFT_TASK_LABEL_MAX} characters`),
  /** RFC 5545: a floating `DTSTART:YYYYMMDDTHHMMSS` line and an `RRULE:` line; every problem named. */
  rrule: z
    .string()
    .max(SHIFT_TASK_RULE_MAX, `use at most ${SHIFT_TASK_RULE_MAX} characters`)
    .superRefine((rule, ctx) => {
      for (const message of ruleProblems(rule)) ctx.addIssue({ code: 'custom', message });
    }),
  durationMinutes: z
    .number()
    .int('whole minutes')
    .min(SHIFT_TASK_MINUTES.min, `at least ${SHIFT_TASK_MINUTES.min} minute`)
    .max(SHIFT_TASK_MINUTES.max, `at most ${SHIFT_TASK_MINUTES.max} minutes`),
};

/** `POST /api/shift-tasks`. */
export const shiftTaskInputSchema = z.object({ roomId: z.number().int().positive('choose a room'), ...taskFields });
/** `PUT /api/shift-tasks/:taskId`: a task stays in its room. */
export const shiftTaskUpdateSchema = z.object(taskFields);
export type ShiftTaskInput = z.input<typeof shiftTaskInputSchema>;
export type ShiftTaskUpdate = z.input<typeof shiftTaskUpdateSchema>;

/** A recurring task as Setup lists it. */
export interface ShiftTaskView {
  id: number;
  roomId: number;
  roomName: string;
  key: string;
  label: string;
  rrule: string;
  durationMinutes: number;
  retired: boolean;
  createdAt: string;
}

/**
 * `GET /api/days/:date/plan` and `PATCH /api/exams/:id` response types (the public contract).
 * The plan's own types are the engine's (`shared/turnover/day-plan-types.ts`).
 */
import type { DayPlanInput } from '../turnover/day-plan-input';
import type { DayPlan } from '../turnover/day-plan-types';

export type { Mobility, Precaution, Verdict } from '../turnover/model';
export type { DayPlan, GapPeopleReason, PlanExam, PlanGap, PlanPeople, PlanPerson, PlanPersonWork, PlanProtocol, PlanRoom, PlanStep, PlanSummary } from '../turnover/day-plan-types';

/**
 * A day's plan as the API answers it (`GET /api/days/:date/plan` and every change): the plan and
 * the very input the server computed it from, so a client's live preview runs the same engine
 * on the same input and can never disagree with the server.
 */
export interface PlannedDay extends DayPlan {
  input: DayPlanInput;
}

/** The turnover engine: shared by the server (day plans) and the client (live previews). */
export * from './model';
export * from './protocols';
export * from './no-protocol';
export * from './step-set';
export * from './solver';
export * from './air-hold';
export * from './verdict';
export * from './plan-turnover';
export * from './day-plan-input';
export * from './day-plan';
export * from './zoned-time';
export type { DayPlan, GapPeopleReason, PlanExam, PlanGap, PlanPeople, PlanPerson, PlanPersonWork, PlanProtocol, PlanRoom, PlanStep, PlanSummary } from './day-plan-types';

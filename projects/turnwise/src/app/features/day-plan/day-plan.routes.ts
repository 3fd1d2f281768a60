import { Routes } from '@angular/router';

import { DayPlan } from './day-plan';

// Both `/day?date=2027-03-15` and `/day/2027-03-15` bind `date` to the component's input.
export default [
  { path: '', component: DayPlan },
  { path: ':date', component: DayPlan },
] satisfies Routes;

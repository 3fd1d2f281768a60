import { Routes } from '@angular/router';

import { DayPlan } from './day-plan';

export default [{ path: '', component: DayPlan }] satisfies Routes;

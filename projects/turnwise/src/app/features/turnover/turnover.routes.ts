import { Routes } from '@angular/router';

import { Turnover } from './turnover';

export default [{ path: '', component: Turnover }] satisfies Routes;

import { Routes } from '@angular/router';

import { Turnover } from './turnover';

export default [
  { path: '', component: Turnover },
  { path: 'log', title: 'Cleaning log', loadComponent: () => import('./cleaning-log').then((m) => m.CleaningLog) },
] satisfies Routes;

import { Routes } from '@angular/router';

import { Setup } from './setup';

export default [{ path: '', component: Setup }] satisfies Routes;

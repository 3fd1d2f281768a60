import { Routes } from '@angular/router';

import { Reports } from './reports';

export default [{ path: '', component: Reports }] satisfies Routes;

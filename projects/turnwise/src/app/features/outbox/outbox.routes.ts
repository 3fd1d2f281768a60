import { Routes } from '@angular/router';

import { Outbox } from './outbox';

export default [{ path: '', component: Outbox }] satisfies Routes;

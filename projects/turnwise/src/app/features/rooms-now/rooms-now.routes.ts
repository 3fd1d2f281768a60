import { Routes } from '@angular/router';

import { RoomsNow } from './rooms-now';

export default [{ path: '', component: RoomsNow }] satisfies Routes;

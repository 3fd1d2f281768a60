import { Routes } from '@angular/router';

import { Profile } from './profile';

export default [{ path: '', component: Profile }] satisfies Routes;

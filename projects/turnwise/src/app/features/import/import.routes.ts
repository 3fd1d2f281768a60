import { Routes } from '@angular/router';

import { Import } from './import';

export default [{ path: '', component: Import }] satisfies Routes;

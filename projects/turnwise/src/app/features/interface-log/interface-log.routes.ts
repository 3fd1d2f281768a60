import { Routes } from '@angular/router';

import { InterfaceLog } from './interface-log';

export default [{ path: '', component: InterfaceLog }] satisfies Routes;

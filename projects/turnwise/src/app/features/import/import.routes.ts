import { Routes } from '@angular/router';

import { Import } from './import';
import { ImportService } from './import-service';

export default [{ path: '', component: Import, providers: [ImportService] }] satisfies Routes;

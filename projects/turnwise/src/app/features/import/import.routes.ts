import { Routes } from '@angular/router';

import { Import } from './import';
import { provideImportHttp } from './import-service';

export default [{ path: '', component: Import, providers: provideImportHttp() }] satisfies Routes;

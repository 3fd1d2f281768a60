import { Route, Routes } from '@angular/router';

import { authGuard } from './core/auth/auth-guard';
import { homeRedirectGuard, roleGuard } from './core/auth/role-guard';
import { screen } from './core/auth/roles';

/** A lazy screen under the shell, guarded by the roles listed for it in roles.ts. */
function screenRoute(path: string, loadChildren: Route['loadChildren']): Route {
  const { label, roles } = screen(path);
  return { path, title: label, canActivate: [authGuard, roleGuard(roles)], loadChildren };
}

export const routes: Routes = [
  {
    path: 'sign-in',
    title: 'Sign in',
    loadComponent: () => import('./features/sign-in/sign-in').then((m) => m.SignIn),
  },
  {
    // Outside the shell: the printed day has no toolbar or navigation and flows onto paper whole.
    path: 'day/:date/sheet',
    title: 'Day sheet',
    canActivate: [authGuard, roleGuard(screen('day').roles)],
    loadComponent: () => import('./features/day-sheet/day-sheet').then((m) => m.DaySheet),
  },
  {
    path: '',
    loadComponent: () => import('./core/layout/shell').then((m) => m.Shell),
    canActivate: [authGuard],
    children: [
      { path: '', pathMatch: 'full', canActivate: [homeRedirectGuard], children: [] },
      screenRoute('day', () => import('./features/day-plan/day-plan.routes')),
      screenRoute('import', () => import('./features/import/import.routes')),
      screenRoute('rooms-now', () => import('./features/rooms-now/rooms-now.routes')),
      screenRoute('turnover', () => import('./features/turnover/turnover.routes')),
      screenRoute('reports', () => import('./features/reports/reports.routes')),
      screenRoute('setup', () => import('./features/setup/setup.routes')),
      screenRoute('outbox', () => import('./features/outbox/outbox.routes')),
      screenRoute('interface-log', () => import('./features/interface-log/interface-log.routes')),
      {
        // every role's own account (the user menu); not a screen of the navigation
        path: 'profile',
        title: 'Your profile',
        canActivate: [authGuard],
        loadChildren: () => import('./features/profile/profile.routes'),
      },
      {
        path: 'not-available',
        title: 'Not available',
        loadComponent: () => import('./core/layout/not-available').then((m) => m.NotAvailable),
      },
    ],
  },
  {
    path: '**',
    title: 'Page not found',
    loadComponent: () => import('./core/layout/not-found').then((m) => m.NotFound),
  },
];

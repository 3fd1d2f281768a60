import { ROLE_LABELS, ROLES, Role, SessionUser } from '@shared/api/auth';

// Roles and the user shape are the API's (shared with the server); the client only adds which
// screens each role is offered. The server enforces access on every route regardless.
export { ROLES };
export type { Role, SessionUser };

/** A screen of the product, as the navigation and the route guards see it. */
export interface Screen {
  /** Route path under the shell, without a leading slash. */
  path: string;
  /** The screen's name, used in the navigation and the page title. */
  label: string;
  /** Name of an icon registered in core/layout/icons.ts. */
  icon: string;
  roles: readonly Role[];
}

/** The screens in navigation order, each with the roles that may use it. */
export const SCREENS: readonly Screen[] = [
  { path: 'day', label: 'Day plan', icon: 'view_timeline', roles: ROLES },
  { path: 'import', label: 'Import', icon: 'upload_file', roles: ['scheduler', 'charge', 'admin'] },
  { path: 'rooms-now', label: 'Rooms now', icon: 'meeting_room', roles: ROLES },
  { path: 'turnover', label: 'Turnover', icon: 'cleaning_services', roles: ['tech', 'charge', 'admin'] },
  { path: 'reports', label: 'Reports', icon: 'bar_chart', roles: ['charge', 'admin'] },
  { path: 'setup', label: 'Setup', icon: 'settings', roles: ['admin'] },
  { path: 'outbox', label: 'Outbox', icon: 'outbox', roles: ['admin'] },
  { path: 'interface-log', label: 'Interface log', icon: 'sync_alt', roles: ['admin'] },
];

/** The role as people read it, e.g. "Charge technologist". */
export function roleLabel(role: Role): string {
  return ROLE_LABELS[role] ?? role;
}

/** The screen with this path; throws on a typo so a route can never silently lose its guard. */
export function screen(path: string): Screen {
  const found = SCREENS.find((candidate) => candidate.path === path);
  if (!found) throw new Error(`No screen "${path}" in SCREENS`);
  return found;
}

export function screensFor(role: Role): Screen[] {
  return SCREENS.filter((candidate) => candidate.roles.includes(role));
}

/** Where a role lands after signing in: the screen it spends its day on. */
export function homeFor(role: Role): string {
  switch (role) {
    case 'frontdesk':
      return '/rooms-now';
    case 'tech':
      return '/turnover';
    default:
      return '/day';
  }
}

/**
 * What a role may do beyond seeing a screen. Components ask {@link may} and never keep their own
 * role lists; the server checks the same on every route (admin may do everything).
 */
export const ABILITIES = {
  /** Drag and keyboard moves, undo and redo, single-exam edits. */
  moveSlots: ['scheduler', 'charge', 'admin'],
  /** People on a turnover or a room; accept a suggested fix. */
  changeStaffing: ['charge', 'admin'],
  /** "Make the day fit": ask for the whole-day proposal and apply it. */
  makeDayFit: ['charge', 'admin'],
  /** Who is on shift on a day (the roster); every role may read it. */
  editRoster: ['charge', 'admin'],
  /** Replace a day's list from a file. */
  importDayList: screen('import').roles,
  /** Tick steps, record an exam's end, close a turnover, log cleaning. */
  workTurnovers: ['tech', 'charge', 'admin'],
  /** Mark a patient arrived. */
  markArrivals: ['frontdesk', 'charge', 'tech', 'admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Ability = keyof typeof ABILITIES;

/**
 * Whether a signed-in role may do it; false for no user.
 *
 * @example
 * may('scheduler', 'moveSlots'); // true
 * may('tech', 'moveSlots'); // false
 */
export function may(role: Role | null | undefined, ability: Ability): boolean {
  return !!role && (ABILITIES[ability] as readonly Role[]).includes(role);
}

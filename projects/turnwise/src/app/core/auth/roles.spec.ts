import { ROLES, Role, homeFor, may, screen, screensFor } from './roles';

// Expected access comes from the project brief's screen list (our product rule, not a published source).
const EXPECTED: Record<Role, string[]> = {
  admin: ['day', 'import', 'rooms-now', 'turnover', 'reports', 'setup', 'outbox', 'interface-log'],
  scheduler: ['day', 'import', 'rooms-now'],
  charge: ['day', 'import', 'rooms-now', 'turnover', 'reports'],
  tech: ['day', 'rooms-now', 'turnover'],
  frontdesk: ['day', 'rooms-now'],
};

describe('screensFor', () => {
  it.each(ROLES)('returns exactly the screens the %s role may use, in navigation order', (role) => {
    expect(screensFor(role).map((s) => s.path)).toEqual(EXPECTED[role]);
  });
});

describe('homeFor', () => {
  it('sends each role to the screen it works on', () => {
    expect(homeFor('frontdesk')).toBe('/rooms-now');
    expect(homeFor('tech')).toBe('/turnover');
    expect(homeFor('scheduler')).toBe('/day');
    expect(homeFor('charge')).toBe('/day');
    expect(homeFor('admin')).toBe('/day');
  });

  it('only ever names a screen the role may use', () => {
    for (const role of ROLES) {
      expect(screensFor(role).map((s) => '/' + s.path)).toContain(homeFor(role));
    }
  });
});

describe('screen', () => {
  it('throws on an unknown path so a route cannot lose its guard', () => {
    expect(() => screen('day-plan')).toThrow('No screen "day-plan"');
  });
});

describe('may', () => {
  it('lets the roles that may move slots move them, and no one signed out', () => {
    expect(ROLES.filter((role) => may(role, 'moveSlots'))).toEqual(expect.arrayContaining(['scheduler', 'charge', 'admin']));
    expect(may('tech', 'moveSlots')).toBe(false);
    expect(may('frontdesk', 'moveSlots')).toBe(false);
    expect(may(null, 'moveSlots')).toBe(false);
  });

  it('keeps staffing to the charge technologist and admin', () => {
    expect(ROLES.filter((role) => may(role, 'changeStaffing')).sort()).toEqual(['admin', 'charge']);
  });

  it('offers import exactly to the roles that see the Import screen', () => {
    expect(ROLES.filter((role) => may(role, 'importDayList'))).toEqual(ROLES.filter((role) => screen('import').roles.includes(role)));
  });
});

import type { WeeklyRoster } from '@shared/api/roster';
import { button, errorUnder, refusal, renderSetup, settle } from '../../../testing/setup-dialogs';
import { WeeklyRosterDialog } from './weekly-roster-dialog';

// Invented: two aides on Mondays across MR 1 and MR 2; nobody set for the other weekdays.
const MONDAY = [{ name: null, role: 'aide' as const, count: 2, start: '07:00', end: '15:00', breaks: [], roomIds: [1, 2] }];
const WEEKLY: WeeklyRoster = { weekdays: [1, 2, 3, 4, 5, 6, 7].map((weekday) => ({ weekday, rows: weekday === 1 ? MONDAY : [] })) };
const ROOMS = [{ id: 1, name: 'MR 1' }, { id: 2, name: 'MR 2' }];

async function render() {
  const view = renderSetup(WeeklyRosterDialog);
  await settle(view.fixture);
  view.backend.expectOne({ method: 'GET', url: '/api/roster/weekly' }).flush({ weekly: WEEKLY });
  view.backend.expectOne({ method: 'GET', url: '/api/rooms' }).flush({ rooms: ROOMS });
  await settle(view.fixture);
  return view;
}

describe('WeeklyRosterDialog', () => {
  it("shows Monday's rows and saves them, a 422 problem under its field", async () => {
    const { fixture, backend, page } = await render();
    expect(page.querySelectorAll('li.row')).toHaveLength(1);
    button(page, 'Save Monday').click();
    await settle(fixture);
    const request = backend.expectOne({ method: 'PUT', url: '/api/roster/weekly/1' });
    expect(request.request.body).toEqual({ rows: MONDAY });
    request.flush(...refusal([{ field: 'rows.0.end', message: 'the shift must end after it starts' }]));
    await settle(fixture);
    expect(errorUnder(page, 'li.row input[formcontrolname="end"]')).toBe('the shift must end after it starts');
  });

  it("shows another weekday's rows on picking it, and will not send a person covering no room", async () => {
    const { fixture, backend, page } = await render();
    page.querySelector<HTMLButtonElement>('mat-button-toggle:nth-child(3) button')!.click();
    await settle(fixture);
    expect(page.querySelectorAll('li.row')).toHaveLength(0);
    button(page, 'Person').click();
    await settle(fixture);
    button(page, 'Save Wednesday').click();
    await settle(fixture);
    backend.expectNone({ method: 'PUT', url: '/api/roster/weekly/3' });
    expect(errorUnder(page, 'li.row mat-select[formcontrolname="roomIds"]')).toBe('required');
  });
});

import type { DayRoster } from '@shared/api/roster';
import { button, errorUnder, refusal, renderSetup, settle } from '../../../testing/setup-dialogs';
import { RosterDialog, type RosterDialogData } from './roster-dialog';

// Invented shift: Sam Example and two aides across MR 1 and MR 2.
const ROSTER: DayRoster = {
  date: '2027-03-16',
  source: 'weekly',
  walkingMinutes: 3,
  rows: [
    { name: 'Sam Example', role: 'technologist', count: 1, start: '07:00', end: '15:30', breaks: [{ start: '11:00', end: '11:30' }], roomIds: [1] },
    { name: null, role: 'aide', count: 2, start: '08:00', end: '16:00', breaks: [], roomIds: [1, 2] },
  ],
  people: [],
};
const DATA: RosterDialogData = { date: '2027-03-16', rooms: [{ id: 1, name: 'MR 1' }, { id: 2, name: 'MR 2' }], readOnly: false };

async function render(data: RosterDialogData = DATA, roster: DayRoster = ROSTER) {
  const view = renderSetup(RosterDialog, data);
  await settle(view.fixture);
  view.backend.expectOne({ method: 'GET', url: '/api/days/2027-03-16/roster' }).flush({ roster });
  await settle(view.fixture);
  return view;
}

const value = (page: HTMLElement, selector: string) => page.querySelector<HTMLInputElement>(selector)!.value;

describe('RosterDialog', () => {
  it("shows the roster in force with where it comes from, and saves the rows as the API takes them", async () => {
    const { fixture, backend, page, close } = await render();
    expect(page.querySelector('.source')?.textContent).toContain("weekday's default");
    expect(page.querySelectorAll('li.row')).toHaveLength(2);
    expect(value(page, 'li.row:nth-child(1) input[formcontrolname="name"]')).toBe('Sam Example');
    // A named person has no count to give; a count row does.
    expect(page.querySelector('li.row:nth-child(1) input[formcontrolname="count"]')).toBeNull();
    expect(value(page, 'li.row:nth-child(2) input[formcontrolname="count"]')).toBe('2');

    button(page, 'Save roster').click();
    await settle(fixture);
    const request = backend.expectOne({ method: 'PUT', url: '/api/days/2027-03-16/roster' });
    expect(request.request.body).toEqual({ rows: ROSTER.rows });
    const saved = { ...ROSTER, source: 'day' as const };
    request.flush({ roster: saved });
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(saved);
  });

  it("puts the API's 422 problems under their fields, a break's under the break", async () => {
    const { fixture, backend, page, close } = await render();
    button(page, 'Save roster').click();
    await settle(fixture);
    backend.expectOne({ method: 'PUT', url: '/api/days/2027-03-16/roster' }).flush(
      ...refusal([
        { field: 'rows.0.breaks.0.start', message: 'the break is outside the shift (07:00–15:30)' },
        { field: 'rows.1.end', message: 'the shift must end after it starts' },
      ]),
    );
    await settle(fixture);
    expect(errorUnder(page, 'li.row:nth-child(1) .break input[formcontrolname="start"]')).toBe('the break is outside the shift (07:00–15:30)');
    expect(errorUnder(page, 'li.row:nth-child(2) input[formcontrolname="end"]')).toBe('the shift must end after it starts');
    expect(close).not.toHaveBeenCalled();
  });

  it('adds a count of aides covering the rooms of the row above, and removes a row', async () => {
    const { fixture, page } = await render();
    button(page, 'Count of aides').click();
    await settle(fixture);
    expect(page.querySelectorAll('li.row')).toHaveLength(3);
    expect(page.querySelector('li.row:nth-child(3) legend')?.textContent).toContain('2 × aide');
    page.querySelector<HTMLButtonElement>('li.row:nth-child(1) .remove-row')!.click();
    await settle(fixture);
    expect(page.querySelectorAll('li.row')).toHaveLength(2);
  });

  it('returns a day with its own roster to the weekly default', async () => {
    const { fixture, backend, page, close } = await render(DATA, { ...ROSTER, source: 'day' });
    button(page, 'Use the weekly default').click();
    await settle(fixture);
    backend.expectOne({ method: 'DELETE', url: '/api/days/2027-03-16/roster' }).flush({ roster: ROSTER });
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(ROSTER);
  });

  it('shows a role that may not change it the roster read-only, with nothing to save', async () => {
    const { page } = await render({ ...DATA, readOnly: true });
    expect(page.querySelector<HTMLInputElement>('input[formcontrolname="name"]')!.disabled).toBe(true);
    expect(() => button(page, 'Save roster')).toThrow();
    expect(page.querySelector('.remove-row')).toBeNull();
  });
});

describe('RosterDialog: a roster file', () => {
  const pick = (page: HTMLElement, content: string) => {
    const input = page.querySelector<HTMLInputElement>('input[type="file"]')!;
    Object.defineProperty(input, 'files', { value: [new File([content], 'roster.csv', { type: 'text/csv' })], configurable: true });
    input.dispatchEvent(new Event('change'));
  };

  it('previews the file and shows its rows for review, saving nothing yet', async () => {
    const { fixture, backend, page } = await render();
    pick(page, 'role,count,start,end,rooms\naide,3,07:00,15:00,MR 1 + MR 2\n');
    await settle(fixture);
    backend.expectOne({ method: 'POST', url: '/api/days/2027-03-16/roster/import?dryRun=true' }).flush({ dryRun: true, rows: [ROSTER.rows[1]], roster: null });
    await settle(fixture);
    expect(page.querySelectorAll('li.row')).toHaveLength(1);
    backend.expectNone({ method: 'PUT', url: '/api/days/2027-03-16/roster' });
  });

  it("lists a refused file's problems by row and column, and keeps the rows as they were", async () => {
    const { fixture, backend, page } = await render();
    pick(page, 'role,start,end,rooms\nporter,07:00,15:00,MR 1\n');
    await settle(fixture);
    backend
      .expectOne({ method: 'POST', url: '/api/days/2027-03-16/roster/import?dryRun=true' })
      .flush(...refusal([{ field: 'row 2, role', message: 'a role is technologist or aide' }], 'The roster file has 1 problem; nothing was imported.'));
    await settle(fixture);
    expect(page.querySelector('.file-errors')?.textContent).toContain('row 2, role: a role is technologist or aide');
    expect(page.querySelectorAll('li.row')).toHaveLength(2);
  });
});

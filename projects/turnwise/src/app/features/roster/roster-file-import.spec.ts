import { refusal, renderSetup, settle } from '../../../testing/setup-dialogs';
import { RosterFileImport } from './roster-file-import';

const URL = '/api/days/2027-03-16/roster/import';
// Invented: Sam Example and three aides.
const ROWS = [
  { name: 'Sam Example', role: 'technologist', count: 1, start: '07:00', end: '15:30', breaks: [], roomIds: [1] },
  { name: null, role: 'aide', count: 3, start: '07:00', end: '15:00', breaks: [], roomIds: [1, 2] },
];

async function render() {
  const view = renderSetup(RosterFileImport);
  view.fixture.componentRef.setInput('date', '2027-03-16');
  await settle(view.fixture);
  return view;
}

function pick(page: HTMLElement) {
  const input = page.querySelector<HTMLInputElement>('input[type="file"]')!;
  Object.defineProperty(input, 'files', { value: [new File(['role,start,end,rooms\n'], 'roster.csv', { type: 'text/csv' })], configurable: true });
  input.dispatchEvent(new Event('change'));
}

describe('RosterFileImport', () => {
  it('checks the file first, shows who is on it, then imports it as the day’s roster', async () => {
    const { fixture, backend, page } = await render();
    pick(page);
    await settle(fixture);
    backend.expectOne({ method: 'POST', url: `${URL}?dryRun=true` }).flush({ dryRun: true, rows: ROWS, roster: null });
    await settle(fixture);
    expect(page.textContent).toContain('4 people on shift: Sam Example, 3 × aide');
    page.querySelector<HTMLButtonElement>('.import-roster')!.click();
    await settle(fixture);
    backend.expectOne({ method: 'POST', url: URL }).flush({ dryRun: false, rows: ROWS, roster: { people: [{}, {}, {}, {}] } });
    await settle(fixture);
    expect(page.querySelector('[role="status"]')?.textContent).toContain('Roster imported: 4 people on shift');
  });

  it('lists every problem of a refused file by row and column', async () => {
    const { fixture, backend, page } = await render();
    pick(page);
    await settle(fixture);
    backend
      .expectOne({ method: 'POST', url: `${URL}?dryRun=true` })
      .flush(...refusal([{ field: 'row 2, role', message: 'a role is technologist or aide' }, { field: 'row 3, rooms', message: 'no room "MR 7" is set up (or it is retired)' }], 'The roster file has 2 problems; nothing was imported.'));
    await settle(fixture);
    const alert = page.querySelector('[role="alert"]')!.textContent!;
    expect(alert).toContain('The roster file has 2 problems; nothing was imported.');
    expect(alert).toContain('row 2, role: a role is technologist or aide');
    expect(alert).toContain('row 3, rooms: no room "MR 7" is set up');
  });
});

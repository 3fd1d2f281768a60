import { HttpEventType } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { By } from '@angular/platform-browser';
import { provideRouter } from '@angular/router';

import type { ImportRefusal, ImportResult } from '@shared/api/import';
import { computeDayPlan, type DayPlanInput } from '@shared/turnover';
import { fakeAuth } from '../../../testing/fake-auth';
import { provideApiHttp } from '../../core/http/api-http';
import { provideIcons } from '../../core/layout/icons';
import { DropZone } from './drop-zone';
import { Import } from './import';
import { ImportService } from './import-service';
import { DEMO_SETUP } from '@shared/turnover/demo-protocols';

const URL = '/api/days/2027-03-15/exams/import';
const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };

// Invented data: a re-import of a day that had ACC-1..ACC-3.
const preview: ImportResult = {
  dryRun: true,
  date: '2027-03-15',
  fileName: 'monday.csv',
  imported: 2,
  added: ['ACC-4'],
  changed: [
    {
      accession: 'ACC-1', fields: ['start', 'coil'],
      values: [{ column: 'start', from: '2027-03-15T07:40:00-05:00', to: '2027-03-15T08:00:00-05:00' }, { column: 'coil', from: '', to: 'knee' }],
    },
  ],
  removed: ['ACC-2', 'ACC-3'],
  unchanged: 0,
  warnings: [{ row: 3, column: 'start', message: 'start 7:05 read as 07:05.' }],
  rows: [
    { row: 2, accession: 'ACC-1', room: 'MR 1', start: '2027-03-15T08:00:00-05:00', durationMinutes: 30, procedure: 'MR knee', coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null },
    { row: 3, accession: 'ACC-4', room: 'MR 2', start: '2027-03-15T07:05:00-05:00', durationMinutes: 45, procedure: 'MR brain with contrast', coil: 'head', precaution: 'airborne', mobility: 'stretcher', contrast: true, notes: null },
  ],
  summary: { fits: 1, snug: 0, short: 1, overlap: 0, minutesShort: 6 },
  dayVersion: 7,
};

async function render() {
  const snackBar = { open: jest.fn() };
  TestBed.configureTestingModule({
    imports: [Import],
    providers: [
      provideRouter([]),
      provideApiHttp(),
      ImportService,
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'sam', role: 'scheduler' }).provider,
      { provide: MatSnackBar, useValue: snackBar },
    ],
  });
  const fixture = TestBed.createComponent(Import);
  fixture.componentRef.setInput('date', '2027-03-15');
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  await settle(fixture);
  return { fixture, backend, snackBar, page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<Import>) {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

const text = (element: Element | null) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

/** Chooses a file as the drop zone would, and returns the preview request. */
function chooseFile(setup: Awaited<ReturnType<typeof render>>, name = 'monday.csv'): TestRequest {
  const file = new File(['accession,room\n'], name, { type: 'text/csv' });
  setup.fixture.debugElement.query(By.directive(DropZone)).componentInstance.chosen.emit(file);
  return setup.backend.expectOne((request) => request.url === URL);
}

describe('Import', () => {
  afterEach(() => {
    const backend = TestBed.inject(HttpTestingController);
    // The day's plan input (for the problem gaps) is answered only by the tests about it.
    backend.match('/api/days/2027-03-15/plan');
    backend.verify();
  });

  it('previews with dryRun, showing progress, counts, the removed exams and every row in site time', async () => {
    const setup = await render();
    const request = chooseFile(setup);
    expect(request.request.params.get('dryRun')).toBe('true');
    expect((request.request.body as FormData).get('file')).toBeInstanceOf(File);
    request.event({ type: HttpEventType.UploadProgress, loaded: 50, total: 100 });
    await settle(setup.fixture);
    expect(text(setup.page.querySelector('.progress'))).toContain('Checking monday.csv (50 % sent)');

    request.flush(preview);
    await settle(setup.fixture);
    const counts = Array.from(setup.page.querySelectorAll('.counts div')).map(
      (count) => `${text(count.querySelector('dt'))} ${text(count.querySelector('dd'))}`,
    );
    expect(counts).toEqual(['Rows 2', 'Added 1', 'Changed 1', 'Removed 2', 'Unchanged 0']);
    expect(text(setup.page.querySelector('.replace'))).toContain('This day already has 3 exams. Importing replaces that whole list');
    expect(text(setup.page.querySelector('.removed h3'))).toContain('2 exams are on the current list but not in the file, and will be removed');
    expect(Array.from(setup.page.querySelectorAll('.removed li')).map(text)).toEqual(['ACC-2', 'ACC-3']);
    // Each change as the day has it and as the file has it, a start in site time.
    expect(text(setup.page.querySelector('.changed'))).toContain('ACC-1: start 07:40 → 08:00; coil — → knee');
    expect(text(setup.page.querySelector('.warnings'))).toContain('Row 3, start: 7:05 read as 07:05.');
    const rows = Array.from(setup.page.querySelectorAll('tr[mat-row]')).map((row) =>
      Array.from(row.querySelectorAll('td')).map(text),
    );
    expect(rows[1]).toEqual(['3', 'ACC-4', 'MR 2', '07:05', '45', 'MR brain with contrast', 'head', 'airborne', 'stretcher', 'yes']);
    expect(text(setup.page.querySelector('button.commit'))).toContain('Replace the day list with these 2 exams');
  });

  it('lists the problem gaps by room and time, computed from the day\'s own input, and links them to the plan once imported', async () => {
    const setup = await render();
    const rows = [
      { ...preview.rows[0] },
      // 10 min after ACC-1 ends in MR 1: one person needs 20 (product brief check value), so short by 10.
      { ...preview.rows[0], row: 3, accession: 'ACC-5', start: '2027-03-15T08:40:00-05:00' },
      { ...preview.rows[0], row: 4, accession: 'ACC-6', room: 'MR 2', start: '2027-03-15T09:00:00-05:00' },
    ];
    chooseFile(setup).flush({ ...preview, rows, imported: 3 });
    await settle(setup.fixture);
    const input: DayPlanInput = {
      date: '2027-03-15',
      timezone: 'America/Chicago',
      ...DEMO_SETUP,
      snugMarginMinutes: 3,
      rooms: [
        { id: 1, name: 'MR 1', modality: 'MR', airChangesPerHour: 6, staff: 1, opensAt: '07:00', closesAt: '19:00' },
        { id: 2, name: 'MR 2', modality: 'MR', airChangesPerHour: 6, staff: 1, opensAt: '07:00', closesAt: '19:00' },
      ],
      exams: [],
    };
    setup.backend.expectOne('/api/days/2027-03-15/plan').flush({ ...computeDayPlan(input), input });
    await settle(setup.fixture);
    const list = setup.page.querySelector('tw-problem-gap-list')!;
    expect(text(list.querySelector('h3'))).toBe('Problem gaps (1)');
    expect(text(list.querySelector('h4'))).toBe('MR 1');
    expect(Array.from(list.querySelectorAll('li')).map((li) => [text(li.querySelector('span')), li.querySelector('tw-verdict-chip')!.getAttribute('data-verdict'), text(li.querySelector('.short-by'))])).toEqual([
      ['08:40 before ACC-5', 'short', 'short by 10 min'],
    ]);
    expect(list.querySelector('a')).toBeNull();

    setup.page.querySelector<HTMLButtonElement>('button.commit')!.click();
    setup.backend.expectOne((r) => r.url === URL).flush({ ...preview, rows, imported: 3, dryRun: false });
    await settle(setup.fixture);
    expect(setup.page.querySelector('tw-problem-gap-list a')?.getAttribute('href')).toBe('/day/2027-03-15?exam=ACC-5');
  });

  it("offers the day's current list in the import format and an empty template to download", async () => {
    const setup = await render();
    expect(setup.page.querySelector('a.day-list')).toBeNull();
    const input: DayPlanInput = {
      date: '2027-03-15',
      timezone: 'America/Chicago',
      ...DEMO_SETUP,
      rooms: [{ id: 1, name: 'MR 1', modality: 'MR', airChangesPerHour: 6, staff: 1, opensAt: '07:00', closesAt: '19:00' }],
      exams: [{ id: 1, accession: 'ACC-1', roomId: 1, start: '2027-03-15T08:00:00-05:00', durationMinutes: 30, procedure: 'MR knee', coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 1 }],
    };
    setup.backend.expectOne('/api/days/2027-03-15/plan').flush({ ...computeDayPlan(input), input });
    await settle(setup.fixture);
    const csv = (selector: string) => decodeURIComponent(setup.page.querySelector(selector)!.getAttribute('href')!.replace(/^data:text\/csv;charset=utf-8,/, ''));
    expect(setup.page.querySelector('a.day-list')!.getAttribute('download')).toBe('day-list-2027-03-15.csv');
    expect(csv('a.day-list')).toBe('accession,room,start,duration_min,procedure,coil,precaution,mobility,contrast,notes\r\nACC-1,MR 1,08:00,30,MR knee,knee,none,ambulatory,no,\r\n');
    expect(csv('a.template')).toBe('accession,room,start,duration_min,procedure,coil,precaution,mobility,contrast,notes\r\n');
  });

  it('imports without dryRun when Import is pressed, then links to that day plan', async () => {
    const setup = await render();
    chooseFile(setup).flush(preview);
    await settle(setup.fixture);
    setup.page.querySelector<HTMLButtonElement>('button.commit')!.click();
    const request = setup.backend.expectOne((r) => r.url === URL);
    expect(request.request.method).toBe('POST');
    expect(request.request.params.has('dryRun')).toBe(false);
    expect(request.request.params.get('dayVersion')).toBe('7');
    request.flush({ ...preview, dryRun: false });
    await settle(setup.fixture);
    expect(text(setup.page.querySelector('.done h2'))).toBe('Imported 2 exams for Monday 15 March 2027');
    expect(setup.page.querySelector('.done a')?.getAttribute('href')).toBe('/day?date=2027-03-15');
  });

  it('when the day changed since the preview (409 day_changed), previews again and says why', async () => {
    const setup = await render();
    chooseFile(setup).flush(preview);
    await settle(setup.fixture);
    setup.page.querySelector<HTMLButtonElement>('button.commit')!.click();
    setup.backend
      .expectOne((r) => r.url === URL)
      .flush({ error: { code: 'day_changed', message: 'The list changed after your preview.' } }, { status: 409, statusText: 'Conflict' });
    await settle(setup.fixture);
    const again = setup.backend.expectOne((r) => r.url === URL);
    expect(again.request.params.get('dryRun')).toBe('true');
    again.flush({ ...preview, dayVersion: 8, changed: [{ accession: 'ACC-1', fields: ['start'], values: [{ column: 'start', from: '2027-03-15T07:40:00-05:00', to: '2027-03-15T08:00:00-05:00' }] }] });
    await settle(setup.fixture);
    expect(text(setup.page.querySelector('.redone'))).toContain('The day list changed after your last preview');
    expect(text(setup.page.querySelector('button.commit'))).toContain('Replace the day list');
    expect(setup.page.querySelector('.done')).toBeNull();
  });

  it('says a first import adds to an empty day, not that it replaces', async () => {
    const setup = await render();
    chooseFile(setup).flush({ ...preview, changed: [], removed: [], added: ['ACC-1', 'ACC-4'] });
    await settle(setup.fixture);
    expect(setup.page.querySelector('.replace')).toBeNull();
    expect(text(setup.page.querySelector('tw-import-preview'))).toContain('The day has no exams yet; importing adds all 2.');
    expect(text(setup.page.querySelector('button.commit'))).toBe('Import 2 exams');
  });

  it('on 422, lists every error, marks the bad cells in the file and says nothing was imported', async () => {
    const setup = await render();
    const refusal: ImportRefusal = {
      error: { code: 'validation_failed', message: 'The exam list has 2 errors.' },
      errors: [
        { row: 3, column: 'duration_min', message: 'duration_min must be whole minutes from 5 to 480; got "4".' },
        { row: 4, column: 'room', message: 'Room "MR 9" is not set up.' },
      ],
      table: [
        ['accession', 'room', 'start', 'duration_min', 'procedure'],
        ['ACC-1', 'MR 1', '08:00', '30', 'MR knee'],
        ['ACC-2', 'MR 1', '08:40', '4', 'MR spine'],
        ['ACC-3', 'MR 9', '09:30', '30', 'MR hip'],
      ],
    };
    chooseFile(setup).flush(refusal, { status: 422, statusText: 'Unprocessable Entity' });
    await settle(setup.fixture);
    expect(text(setup.page.querySelector('h2'))).toBe('The file was not imported: 2 problems');
    expect(text(setup.page.querySelector('tw-refusal-report'))).toContain('Nothing was imported');
    const errors = Array.from(setup.page.querySelectorAll('.errors li')).map(text);
    expect(errors).toEqual([
      // The column is named once, not "duration_min duration_min must be …".
      'Row 3, duration_min: must be whole minutes from 5 to 480; got "4".',
      'Row 4, room: Room "MR 9" is not set up.',
    ]);
    const bad = Array.from(setup.page.querySelectorAll('table.file td.bad'));
    expect(bad.map((cell) => [text(cell.closest('tr')!.querySelector('th')), cell.textContent!.trim().split(/\s+/)[0]])).toEqual([
      ['3', '4'],
      ['4', 'MR'],
    ]);
    expect(setup.page.querySelectorAll('table.file td:not(.bad)').length).toBe(3 * 5 - 2);
    expect(setup.snackBar.open).not.toHaveBeenCalled();
  });

  it('on 415, shows the server message in the page rather than a snack bar', async () => {
    const setup = await render();
    chooseFile(setup, 'monday.pdf').flush(
      { error: { code: 'unsupported_media_type', message: 'Upload a CSV or an Excel .xlsx file; monday.pdf is neither.' } },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    await settle(setup.fixture);
    const alert = text(setup.page.querySelector('[role="alert"]'));
    expect(alert).toContain('The file could not be checked.');
    expect(alert).toContain('Upload a CSV or an Excel .xlsx file; monday.pdf is neither.');
    expect(setup.snackBar.open).not.toHaveBeenCalled();
    expect(setup.page.querySelector('tw-drop-zone')).not.toBeNull();
  });

  it('lists the file columns as required or optional, and says no patient names are needed', async () => {
    const { page } = await render();
    const help = Array.from(page.querySelectorAll('tw-exam-list-help dt')).map(text);
    expect(help[0]).toBe('accession required');
    expect(help).toContain('coil optional');
    expect(text(page.querySelector('tw-exam-list-help'))).toContain('No patient names or dates of birth are needed');
  });
});

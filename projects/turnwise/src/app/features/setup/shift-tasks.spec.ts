import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';
import type { Type } from '@angular/core';

import type { ShiftTaskView } from '@shared/api/shift-tasks';
import { fakeAuth } from '../../../testing/fake-auth';
import { refusal, settle, submit, type } from '../../../testing/setup-dialogs';
import { provideApiHttp } from '../../core/http/api-http';
import { provideIcons } from '../../core/layout/icons';
import { fakeClock } from '../../core/time/testing/fake-clock';
import { ShiftTaskDialog, type ShiftTaskDialogData } from './shift-task-dialog';
import { ShiftTasksTab } from './shift-tasks-tab';

// Invented site and tasks. 2027-03-05T13:30Z is Friday 5 March 2027, 07:30 in America/Chicago (CST).
const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };
const WIPE: ShiftTaskView = {
  id: 7, roomId: 1, roomName: 'MR 1', key: 'wipe-start', label: 'Workstation wipe-down', rrule: 'DTSTART:20260101T070000\nRRULE:FREQ=DAILY',
  durationMinutes: 5, retired: false, createdAt: '2026-01-01T00:00:00.000Z',
};

async function render<T>(component: Type<T>, data: unknown = null, now = '2027-03-05T13:30:00Z') {
  const close = jest.fn();
  TestBed.configureTestingModule({
    imports: [component],
    providers: [
      provideRouter([]),
      provideApiHttp(),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'admin', role: 'admin' }).provider,
      fakeClock(now).provider,
      { provide: MatDialogRef, useValue: { close } },
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const backend = TestBed.inject(HttpTestingController);
  const fixture = TestBed.createComponent(component);
  // the rule builder reads the site's zone; a list alone does not ask
  for (const request of backend.match('/api/settings')) request.flush(SETTINGS);
  await settle(fixture);
  return { fixture, backend, close, page: fixture.nativeElement as HTMLElement };
}

const text = (el: Element | null) => el?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
const next = (page: HTMLElement) => Array.from(page.querySelectorAll('.preview .next li')).map(text);
const checkbox = (page: HTMLElement, label: string) =>
  Array.from(page.querySelectorAll('mat-checkbox')).find((c) => text(c) === label)!.querySelector<HTMLInputElement>('input')!;

async function choose(fixture: { whenStable: () => Promise<unknown> }, page: HTMLElement, selectLabel: string, option: string) {
  const field = Array.from(page.querySelectorAll('mat-form-field')).find((f) => text(f.querySelector('mat-label')) === selectLabel)!;
  field.querySelector<HTMLElement>('.mat-mdc-select-trigger')!.click();
  await fixture.whenStable();
  Array.from(document.querySelectorAll<HTMLElement>('mat-option')).find((o) => text(o) === option)!.click();
  await fixture.whenStable();
}

describe('Rule builder (in the shift task dialog)', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('shows the next five occurrences live, computed at the site’s zone, as the fields change', async () => {
    const { fixture, page } = await render(ShiftTaskDialog, { task: null, rooms: [{ id: 1, name: 'MR 1' }] } satisfies ShiftTaskDialogData);
    // a new task starts tomorrow at the site, every day at 07:00
    expect(next(page)).toEqual(['Sat 6 Mar 2027, 07:00', 'Sun 7 Mar 2027, 07:00', 'Mon 8 Mar 2027, 07:00', 'Tue 9 Mar 2027, 07:00', 'Wed 10 Mar 2027, 07:00']);

    // every other week on Monday and Friday at 07:30 from Monday 1 March 2027 (the shape of RFC 5545
    // §3.8.5.3's "every other week" examples); dates derived by hand from a calendar
    await choose(fixture, page, 'Repeats', 'Weekly');
    type(page, 'input[formcontrolname="interval"]', '2');
    type(page, 'input[formcontrolname="time"]', '07:30');
    type(page, 'input[formcontrolname="starts"]', '2027-03-01');
    checkbox(page, 'Monday').click();
    checkbox(page, 'Friday').click();
    await settle(fixture);
    expect(text(page.querySelector('.preview h3'))).toBe('Every 2 weeks on Monday and Friday at 07:30, from 2027-03-01');
    // it is 07:30 on Friday 5 March: that occurrence is now, so it is the first; Chicago's clocks change on 14 March
    expect(next(page)).toEqual(['Fri 5 Mar 2027, 07:30', 'Mon 15 Mar 2027, 07:30', 'Fri 19 Mar 2027, 07:30', 'Mon 29 Mar 2027, 07:30', 'Fri 2 Apr 2027, 07:30']);
    expect(text(page.querySelector('.preview .text code'))).toBe('DTSTART:20270301T073000 RRULE:FREQ=WEEKLY;INTERVAL=2;BYDAY=MO,FR');

    // ends after 3 times: Mon 1, Fri 5 (now) and Mon 15 March; only two are still ahead
    Array.from(page.querySelectorAll<HTMLInputElement>('mat-radio-button input')).find((r) => r.value === 'count')!.click();
    await settle(fixture);
    type(page, 'input[formcontrolname="count"]', '3');
    await settle(fixture);
    expect(next(page)).toEqual(['Fri 5 Mar 2027, 07:30', 'Mon 15 Mar 2027, 07:30']);
  });

  it('sends the built rule; the API’s problem with it is shown whole under the form', async () => {
    const { fixture, backend, page, close } = await render(ShiftTaskDialog, { task: null, rooms: [{ id: 1, name: 'MR 1' }] } satisfies ShiftTaskDialogData);
    type(page, 'input[formcontrolname="label"]', 'Coil cart wipe-down');
    type(page, 'input[formcontrolname="durationMinutes"]', '10');
    submit(page);
    const request = backend.expectOne({ method: 'POST', url: '/api/shift-tasks' });
    expect(request.request.body).toEqual({ roomId: 1, label: 'Coil cart wipe-down', durationMinutes: 10, rrule: 'DTSTART:20270306T070000\nRRULE:FREQ=DAILY' });
    request.flush(...refusal([{ field: 'rrule', message: 'FREQ=DAILY: an invented refusal for the test' }]));
    await settle(fixture);
    expect(text(page.querySelector('.form-error'))).toBe('FREQ=DAILY: an invented refusal for the test');
    expect(close).not.toHaveBeenCalled();
  });

  it('edits a rule the builder cannot show as RFC 5545 text, checked with the API’s own rule check', async () => {
    const monthly = { ...WIPE, rrule: 'DTSTART:20270305T070000\nRRULE:FREQ=MONTHLY;BYDAY=1FR' };
    const { fixture, backend, page } = await render(ShiftTaskDialog, { task: monthly, rooms: [] } satisfies ShiftTaskDialogData);
    expect(page.querySelector('tw-rule-builder')).toBeNull();
    type(page, 'textarea[formcontrolname="ruleText"]', 'DTSTART:20270305T070000\nRRULE:FREQ=MONTHLY;BYDAY=1FX');
    submit(page);
    await settle(fixture);
    backend.expectNone('/api/shift-tasks/7');
    expect(text(page.querySelector('textarea')!.closest('mat-form-field')!.querySelector('mat-error'))).toMatch(/^BYDAY=1FX: weekdays as MO, TU, WE, TH, FR, SA, SU \(a MONTHLY rule may number them/);
  });
});

describe('ShiftTasksTab', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('lists each room’s tasks with the rule in words (or as text when the builder cannot say it)', async () => {
    const { fixture, backend, page } = await render(ShiftTasksTab);
    backend.expectOne('/api/shift-tasks').flush({ tasks: [WIPE, { ...WIPE, id: 8, label: 'Monthly QA', rrule: 'DTSTART:20270305T070000\nRRULE:FREQ=MONTHLY;BYDAY=1FR' }] });
    backend.expectOne('/api/rooms/setup').flush({ rooms: [] });
    await settle(fixture);
    const rows = Array.from(page.querySelectorAll('tr.mat-mdc-row')).map((r) => Array.from(r.querySelectorAll('td')).slice(0, 4).map(text));
    expect(rows).toEqual([
      ['MR 1', 'Workstation wipe-down', 'Every day at 07:00, from 2026-01-01', '5'],
      ['MR 1', 'Monthly QA', 'DTSTART:20270305T070000 RRULE:FREQ=MONTHLY;BYDAY=1FR', '5'],
    ]);
  });
});

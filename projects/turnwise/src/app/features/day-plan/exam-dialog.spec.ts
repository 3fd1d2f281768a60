import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';

import type { PlanExam } from '@shared/api/plan';
import { provideApiHttp } from '../../core/http/api-http';
import { provideIcons } from '../../core/layout/icons';
import { fakeAuth } from '../../../testing/fake-auth';
import { ExamDialog, type ExamDialogData } from './exam-dialog';

const DAY = '2027-03-10';
const ROOMS = [
  { id: 1, name: 'MR 1' },
  { id: 2, name: 'MR 2' },
];
const M2: PlanExam = {
  id: 7, accession: 'M-2', roomId: 2, start: `${DAY}T09:00:00-06:00`, durationMinutes: 30, procedure: 'MR knee',
  coil: 'knee', precaution: 'none', mobility: 'ambulatory', contrast: false, notes: null, version: 3,
} as PlanExam;

function render(data: ExamDialogData) {
  const close = jest.fn();
  TestBed.configureTestingModule({
    imports: [ExamDialog],
    providers: [
      provideRouter([]),
      provideApiHttp(),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'scheduler', role: 'scheduler' }).provider,
      { provide: MatDialogRef, useValue: { close } },
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const fixture = TestBed.createComponent(ExamDialog);
  return { fixture, close, backend: TestBed.inject(HttpTestingController), page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

function type(page: HTMLElement, selector: string, value: string): void {
  const input = page.querySelector<HTMLInputElement>(selector)!;
  input.value = value;
  input.dispatchEvent(new Event('input'));
}

function errorUnder(page: HTMLElement, selector: string): string {
  return page.querySelector(selector)!.closest('mat-form-field')!.querySelector('mat-error')?.textContent?.trim() ?? '';
}

function submit(page: HTMLElement): void {
  page.querySelector('form')!.dispatchEvent(new Event('submit'));
}

const plan = { date: DAY, rooms: [] };

describe('ExamDialog', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('adds an exam in the import’s columns and closes with the day’s new plan', async () => {
    const { fixture, backend, page, close } = render({ date: DAY, rooms: ROOMS });
    await settle(fixture);
    type(page, 'input[formcontrolname="accession"]', 'NEW-1');
    type(page, 'input[formcontrolname="start"]', '10:00');
    type(page, 'input[formcontrolname="duration_min"]', '45');
    type(page, 'input[formcontrolname="procedure"]', 'MR brain');
    submit(page);
    const request = backend.expectOne({ method: 'POST', url: `/api/days/${DAY}/exams` });
    expect(request.request.body).toMatchObject({ accession: 'NEW-1', room: 'MR 1', start: '10:00', duration_min: '45', procedure: 'MR brain', precaution: 'none', mobility: 'ambulatory', contrast: false });
    request.flush(plan);
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(plan);
  });

  it('puts the API’s 422 problems (keyed by column) under their fields and stays open', async () => {
    const { fixture, backend, page, close } = render({ date: DAY, rooms: ROOMS });
    await settle(fixture);
    type(page, 'input[formcontrolname="accession"]', 'M-1');
    type(page, 'input[formcontrolname="start"]', '10:00');
    type(page, 'input[formcontrolname="duration_min"]', '4');
    type(page, 'input[formcontrolname="procedure"]', 'MR brain');
    submit(page);
    backend.expectOne({ method: 'POST', url: `/api/days/${DAY}/exams` }).flush(
      {
        error: {
          code: 'validation_failed',
          message: 'The exam was not saved.',
          details: { problems: [{ field: 'duration_min', message: 'duration_min must be whole minutes from 5 to 480; got "4".' }, { field: 'accession', message: 'Accession "M-1" is already on the list for 2027-03-10.' }] },
        },
      },
      { status: 422, statusText: 'Unprocessable' },
    );
    await settle(fixture);
    expect(errorUnder(page, 'input[formcontrolname="duration_min"]')).toBe('duration_min must be whole minutes from 5 to 480; got "4".');
    expect(errorUnder(page, 'input[formcontrolname="accession"]')).toContain('"M-1"');
    expect(close).not.toHaveBeenCalled();
  });

  it('edits an exam at the version it was read at, starting from its own fields', async () => {
    const { fixture, backend, page, close } = render({ date: DAY, rooms: ROOMS, exam: M2 });
    await settle(fixture);
    expect(page.querySelector<HTMLInputElement>('input[formcontrolname="start"]')!.value).toBe('09:00');
    type(page, 'input[formcontrolname="duration_min"]', '20');
    submit(page);
    const request = backend.expectOne({ method: 'PUT', url: '/api/exams/7' });
    expect(request.request.body).toMatchObject({ accession: 'M-2', room: 'MR 2', start: '09:00', duration_min: '20', coil: 'knee', version: 3 });
    request.flush(plan);
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(plan);
  });

  it('cancels an exam at its version; a stale version says so and stays open', async () => {
    const { fixture, backend, page, close } = render({ date: DAY, rooms: ROOMS, exam: M2 });
    await settle(fixture);
    page.querySelector<HTMLButtonElement>('button.cancel-exam')!.click();
    const request = backend.expectOne((r) => r.method === 'DELETE' && r.url === '/api/exams/7');
    expect(request.request.params.get('version')).toBe('3');
    request.flush(
      { error: { code: 'stale_version', message: 'Exam M-2 was changed meanwhile.', details: { currentVersion: 4, changedBy: null } } },
      { status: 409, statusText: 'Conflict' },
    );
    await settle(fixture);
    fixture.detectChanges();
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('Exam M-2 was changed meanwhile.');
    expect(close).not.toHaveBeenCalled();
  });
});

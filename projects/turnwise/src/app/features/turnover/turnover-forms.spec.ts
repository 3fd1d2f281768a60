import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';

import type { Checklist } from '@shared/api/board';
import { fakeAuth } from '../../../testing/fake-auth';
import { provideApiHttp } from '../../core/http/api-http';
import { provideIcons } from '../../core/layout/icons';
import { fakeEventSources } from '../../core/live/testing/fake-event-source';
import { fakeClock } from '../../core/time/testing/fake-clock';
import { Turnover } from './turnover';

import { at, clear, exampleChecklist, flushKits, linen, table, ticked } from './testing/example-checklist';

const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };
const ROOMS = { rooms: [{ id: 1, name: 'MR 1', modality: 'MR' }] };

/** Matches the checklist fetch of a room. */
const checklistUrl = (roomId: number) => (request: { url: string }) => request.url === `/api/rooms/${roomId}/turnover`;

/** The Turnover screen of a technologist, showing `checklist` (fetched once), with a settable clock and day stream. */
async function renderTurnover(checklist: Checklist) {
  const events = fakeEventSources();
  const clock = fakeClock(checklist.now);
  TestBed.configureTestingModule({
    imports: [Turnover],
    providers: [
      provideRouter([]),
      provideApiHttp(),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'robin', role: 'tech' }).provider,
      events.provider,
      clock.provider,
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const fixture = TestBed.createComponent(Turnover);
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  backend.expectOne('/api/rooms').flush(ROOMS);
  await settle(fixture);
  backend.expectOne(checklistUrl(checklist.roomId)).flush(checklist);
  await settle(fixture);
  return { fixture, backend, clock, events, page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<unknown>): Promise<void> {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

async function answer(fixture: ComponentFixture<unknown>, request: TestRequest, body: Checklist): Promise<void> {
  request.flush(body);
  await settle(fixture);
}

/** Types into an input as a person would (the components listen to `input`). */
function type(input: HTMLInputElement, value: string): void {
  input.value = value;
  input.dispatchEvent(new Event('input'));
}

const text = (element: Element | null) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';


const row = (page: HTMLElement, key: string) => page.querySelector(`tw-checklist-step-row[data-step="${key}"]`)!;
const button = (scope: Element, selector: string) => scope.querySelector<HTMLButtonElement>(selector)!;
const NEXT_EXAM = exampleChecklist().arriving!;

describe('Turnover: each turnover has its own form, and times come from what happened', () => {
  afterEach(() => {
    const backend = TestBed.inject(HttpTestingController);
    flushKits(backend);
    backend.verify();
  });

  it('does not carry an early-tick reason over to the next turnover', async () => {
    const wet = [ticked(clear, '10:32'), ticked(table, '10:34', at('10:38')), linen];
    const { page, fixture, events, backend } = await renderTurnover(exampleChecklist({ steps: wet, now: at('10:35') }));
    button(row(page, 'linen'), 'button.tick').click();
    await settle(fixture);
    type(row(page, 'linen').querySelector<HTMLInputElement>('.reason input')!, 'Sheet on the dry end only');
    await settle(fixture);

    // Someone else finishes this turnover; the room moves on to the next one, in the same state.
    events.sources[0].change({ kind: 'board', reason: 'turnover complete' });
    const next = exampleChecklist({ turnoverId: 10, steps: wet, now: at('10:35'), leaving: NEXT_EXAM, arriving: null });
    await answer(fixture, backend.expectOne(checklistUrl(1)), next);
    expect(row(page, 'linen').querySelector('.reason input')).toBeNull();
    expect(text(button(row(page, 'linen'), 'button.tick'))).toContain('Tick early'); // still wet: it asks again, empty
  });

  it('does not carry an override reason (or its question) over to the next turnover', async () => {
    const allWet = [ticked(clear, '10:32'), ticked(table, '10:36', at('10:40')), ticked(linen, '10:36')];
    const { page, fixture, events, backend } = await renderTurnover(exampleChecklist({ steps: allWet, now: at('10:37') }));
    button(page, 'button.complete-turnover').click();
    await settle(fixture);
    type(page.querySelector<HTMLInputElement>('.override input')!, 'Next patient is in the chair already');
    await settle(fixture);

    events.sources[0].change({ kind: 'board', reason: 'turnover complete' });
    const next = exampleChecklist({ turnoverId: 10, steps: allWet, now: at('10:37'), leaving: NEXT_EXAM, arriving: null });
    await answer(fixture, backend.expectOne(checklistUrl(1)), next);
    expect(page.querySelector('.override input')).toBeNull();
    expect(text(button(page, 'button.complete-turnover'))).toBe('Turnover complete');
  });

  it('runs no air-hold countdown for a leaving patient not yet finished, and flags a planned hold past the next start', async () => {
    // As an older server answered: an air hold "until" computed from the plan before the exam ended.
    const waiting = exampleChecklist({
      turnoverId: null,
      examEndedAt: null,
      now: at('10:10'),
      precaution: 'airborne',
      airHoldMinutes: 35,
      airHoldUntil: at('11:05'),
      airHoldPlannedUntil: at('11:05'),
      airHoldPastNextStartMinutes: 15,
    });
    const { page } = await renderTurnover(waiting);
    expect(page.querySelector('tw-turnover-close [role="timer"]')).toBeNull();
    expect(text(page.querySelector('.air-hold'))).toBe('35 min from the recorded end; planned until 11:05');
    expect(text(page.querySelector('.hold-late'))).toContain("runs 15 min past ACC-2042's start at 10:50");
    // Nothing to close before the turnover is opened, so nothing asks about the air hold.
    expect(page.querySelector('button.complete-turnover')).toBeNull();
  });

  it('names the exam and room on "Exam finished", and asks why before the slot starts', async () => {
    const early = exampleChecklist({ turnoverId: null, examEndedAt: null, now: at('09:40') }); // ACC-2041's slot starts 09:50
    const { page, fixture, backend } = await renderTurnover(early);
    expect(text(button(page, 'button.exam-finished'))).toBe('Exam finished: ACC-2041 in MR 1');
    button(page, 'button.exam-finished').click();
    await settle(fixture);
    backend.expectNone('/api/exams/41/finished');
    expect(text(page.querySelector('.not-started'))).toContain("ACC-2041's slot starts at 09:50");
    expect(button(page, 'button.exam-finished').disabled).toBe(true);
    type(page.querySelector<HTMLInputElement>('tw-turnover-exams .reason input')!, 'Patient declined at the door');
    await settle(fixture);
    button(page, 'button.exam-finished').click();
    const request = backend.expectOne('/api/exams/41/finished');
    expect(request.request.body).toEqual({ earlyReason: 'Patient declined at the door' });
    await answer(fixture, request, exampleChecklist());
  });

  it('asks why when the server refuses the end as before the slot (its clock rules)', async () => {
    const { page, fixture, backend } = await renderTurnover(exampleChecklist({ turnoverId: null, examEndedAt: null }));
    button(page, 'button.exam-finished').click();
    backend.expectOne('/api/exams/41/finished').flush(
      { error: { code: 'exam_not_started', message: 'ACC-2041 in MR 1 is booked to start at 09:50.', details: { start: at('09:50'), problems: [] } } },
      { status: 422, statusText: 'Unprocessable' },
    );
    await settle(fixture);
    expect(page.querySelector('tw-turnover-exams .reason input')).not.toBeNull();
  });
});

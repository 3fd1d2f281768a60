import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';

import type { DayHistory } from '@shared/api/changes';
import type { DayPlan as Plan } from '@shared/api/plan';
import { AuthService } from '../../../core/auth/auth-service';
import { SessionUser } from '../../../core/auth/roles';
import { provideApiHttp } from '../../../core/http/api-http';
import { provideIcons } from '../../../core/layout/icons';
import { fakeClock } from '../../../core/time/testing/fake-clock';
import { DayPlan } from '../day-plan';
import { EVENT_SOURCE } from '../../../core/live/day-events';
import { dayPlan } from './example-day';

export { DAY_INPUT, ROOMS, dayPlan } from './example-day';

const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };

/** A stand-in EventSource the test drives: `emit()` sends a `change` event. */
export class FakeEventSource {
  static last: FakeEventSource | null = null;
  readyState = 1;
  onopen: (() => void) | null = null;
  onerror: (() => void) | null = null;
  closed = false;
  private readonly listeners: ((event: MessageEvent) => void)[] = [];
  constructor(readonly url: string) {
    FakeEventSource.last = this;
  }
  addEventListener(_type: string, listener: (event: MessageEvent) => void) {
    this.listeners.push(listener);
  }
  emit(data: object) {
    for (const listener of this.listeners) listener(new MessageEvent('change', { data: JSON.stringify(data) }));
  }
  close() {
    this.closed = true;
  }
}

/** What `GET …/history` answers in these specs unless a spec says otherwise (reset by `renderDay`). */
export let historyAnswer: DayHistory = { changes: [], canUndo: true, canRedo: true };
export function answerHistory(answer: Partial<DayHistory>): void {
  historyAnswer = { ...historyAnswer, ...answer };
}

/**
 * Lets the page settle. The store refetches the day's history (undo/redo state) after every
 * change and live event; those fetches are answered here with {@link historyAnswer}, so each
 * spec only answers the calls it is about.
 */
export async function settle(fixture: ComponentFixture<unknown>) {
  for (let round = 0; round < 2; round++) {
    await new Promise((resolve) => setTimeout(resolve));
    await fixture.whenStable();
    for (const request of TestBed.inject(HttpTestingController).match((r) => r.method === 'GET' && r.url.endsWith('/history'))) {
      if (!request.cancelled) request.flush(historyAnswer);
    }
  }
  await fixture.whenStable();
}

/** The Day plan on 2027-03-15 for `user`, with settings, rooms and the plan answered; on a clock stopped at `now` when given. */
export async function renderDay(options: { user?: SessionUser; plan?: Plan | null; date?: string; exam?: string; history?: Partial<DayHistory>; now?: string } = {}) {
  historyAnswer = { changes: [], canUndo: true, canRedo: true, ...options.history };
  TestBed.configureTestingModule({
    imports: [DayPlan],
    providers: [
      provideRouter([]),
      provideApiHttp(),
      provideHttpClientTesting(),
      provideIcons(),
      // No jest here: this file is compiled with the app's tsconfig too.
      { provide: AuthService, useValue: { user: signal(options.user ?? { username: 'jo', displayName: 'Jo Charge', role: 'charge' }).asReadonly() } },
      { provide: MatSnackBar, useValue: { open: () => undefined } },
      { provide: EVENT_SOURCE, useValue: (url: string) => new FakeEventSource(url) },
      ...(options.now ? [fakeClock(options.now).provider] : []),
    ],
  });
  const fixture = TestBed.createComponent(DayPlan);
  if (options.date !== '') fixture.componentRef.setInput('date', options.date ?? '2027-03-15');
  if (options.exam) fixture.componentRef.setInput('exam', options.exam);
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  await settle(fixture);
  if (options.plan !== null) {
    backend.expectOne('/api/days/2027-03-15/plan').flush(options.plan ?? dayPlan());
    await settle(fixture);
  }
  const page = fixture.nativeElement as HTMLElement;
  return { fixture, backend, page };
}

export const text = (element: Element | null | undefined) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
export const block = (page: HTMLElement, examId: number) => page.querySelector<HTMLElement>(`[data-exam-id="${examId}"]`)!;
export const marker = (page: HTMLElement, toExamId: number) => page.querySelector<HTMLButtonElement>(`[data-gap-to="${toExamId}"]`)!;

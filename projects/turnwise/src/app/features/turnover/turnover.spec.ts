import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, TestRequest, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, provideRouter } from '@angular/router';

import type { Checklist } from '@shared/api/board';
import { fakeAuth } from '../../../testing/fake-auth';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { provideIcons } from '../../core/layout/icons';
import { fakeClock } from '../../core/time/testing/fake-clock';
import { fakeEventSources } from '../../core/live/testing/fake-event-source';
import { at, clear, exampleChecklist, flushKits, linen, table, ticked } from './testing/example-checklist';
import { LAST_ROOM_KEY } from './last-room';
import { Turnover } from './turnover';

const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };
const ROOMS = { rooms: [{ id: 1, name: 'MR 1', modality: 'MR' }, { id: 2, name: 'CT 2', modality: 'CT' }] };
const checklistUrl = (roomId: number) => (request: { url: string }) => request.url === `/api/rooms/${roomId}/turnover`;

async function render(checklist: Checklist, options: { room?: string; clockAt?: string } = {}) {
  const events = fakeEventSources();
  const clock = fakeClock(options.clockAt ?? checklist.now);
  TestBed.configureTestingModule({
    imports: [Turnover],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'robin', role: 'tech' }).provider,
      events.provider,
      clock.provider,
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  const fixture = TestBed.createComponent(Turnover);
  if (options.room) fixture.componentRef.setInput('room', options.room);
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  backend.expectOne('/api/rooms').flush(ROOMS);
  await settle(fixture);
  const first = backend.expectOne(checklistUrl(checklist.roomId));
  expect(first.request.params.get('date')).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  first.flush(checklist);
  await settle(fixture);
  return { fixture, backend, clock, events, navigate, page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<unknown>) {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

const text = (element: Element | null) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
const row = (page: HTMLElement, key: string) => page.querySelector(`tw-checklist-step-row[data-step="${key}"]`)!;
const button = (scope: Element, selector: string) => scope.querySelector<HTMLButtonElement>(selector)!;

async function answer(fixture: ComponentFixture<unknown>, request: TestRequest, body: Checklist) {
  request.flush(body);
  await settle(fixture);
}

describe('Turnover', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => {
    const backend = TestBed.inject(HttpTestingController);
    flushKits(backend);
    backend.verify();
  });

  it('records the exam end with the big button, and keeps the steps closed until then', async () => {
    const waiting = exampleChecklist({ examEndedAt: null, turnoverId: null });
    const { page, backend, fixture } = await render(waiting);
    expect(button(row(page, 'clear'), 'button.tick').disabled).toBe(true);
    expect(page.querySelector('.ready-soon')).toBeNull(); // not before the exam is finished
    button(page, 'button.exam-finished').click();
    const request = backend.expectOne('/api/exams/41/finished');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({});
    await answer(fixture, request, exampleChecklist());
    expect(page.querySelector('button.exam-finished')).toBeNull();
    expect(button(row(page, 'clear'), 'button.tick').disabled).toBe(false);
  });

  it('says at the top when the room will be ready, once the turnover is open', async () => {
    const { page } = await render(exampleChecklist());
    expect(text(page.querySelector('.ready-soon'))).toBe('· ready at 10:40');
  });

  it('says how far past the arriving patient\'s start the room will be ready when it runs late', async () => {
    const { page } = await render(exampleChecklist({ readyAt: at('10:56') }));
    expect(text(page.querySelector('.ready-soon'))).toBe("· ready at 10:56, 6 min after ACC-2042's start");
  });

  it('says which protocol version the turnover was planned with, and when a step is applied more than once (re-wet)', async () => {
    const rewet = { ...table, applications: 3 };
    const { page } = await render(exampleChecklist({ protocol: { id: 5, modality: 'MR', version: 2, effectiveFrom: '2027-03-01' }, steps: [clear, rewet, linen] }));
    expect(text(page.querySelector('.protocol'))).toBe('Planned with the MR protocol, version 2 (in force from 2027-03-01).');
    // re-wet: the surface must stay wet for the whole label contact time (common practice, no source)
    expect(text(row(page, 'table').querySelector('.applications'))).toBe('applied 3 times: the product dries before its contact time');
    expect(row(page, 'clear').querySelector('.applications')).toBeNull();
  });

  it('ticks a disinfecting step with the product picked', async () => {
    const { page, backend, fixture } = await render(exampleChecklist({ steps: [ticked(clear, '10:32'), table, linen] }));
    const select = row(page, 'table').querySelector('select')!;
    expect(select.value).toBe('standard');
    expect(text(row(page, 'table').querySelector('.contact'))).toBe('2 min contact');
    select.value = 'sporicidal';
    select.dispatchEvent(new Event('change'));
    await settle(fixture);
    // The contact time shown follows the product picked (sporicidal: 4 min in the example products).
    expect(text(row(page, 'table').querySelector('.contact'))).toBe('4 min contact');
    button(row(page, 'table'), 'button.tick').click();
    const request = backend.expectOne('/api/turnovers/9/steps/table/done');
    expect(request.request.body).toEqual({ productKey: 'sporicidal' });
    await answer(fixture, request, exampleChecklist({ steps: [ticked(clear, '10:32'), ticked(table, '10:34', at('10:38')), linen] }));
    expect(text(row(page, 'table').querySelector('.ticked'))).toContain('Done 10:34 by Robin Example');
  });

  it('ticks a step without a product with an empty body', async () => {
    const { page, backend, fixture } = await render(exampleChecklist());
    expect(row(page, 'clear').querySelector('select')).toBeNull();
    button(row(page, 'clear'), 'button.tick').click();
    const request = backend.expectOne('/api/turnovers/9/steps/clear/done');
    expect(request.request.body).toEqual({});
    await answer(fixture, request, exampleChecklist());
  });

  it('counts the wet time down from the actual tick on the clock', async () => {
    const steps = [ticked(clear, '10:32'), ticked(table, '10:36', at('10:40')), linen];
    const { page, clock, fixture } = await render(exampleChecklist({ steps, now: at('10:36', '40') }));
    expect(text(row(page, 'table').querySelector('.wet'))).toBe('wet until 10:40 (3:20 left)');
    clock.set(at('10:39'));
    await settle(fixture);
    expect(text(row(page, 'table').querySelector('.wet'))).toBe('wet until 10:40 (1:00 left)');
    clock.set(at('10:41'));
    await settle(fixture);
    expect(row(page, 'table').querySelector('.wet')).toBeNull();
    expect(text(row(page, 'table').querySelector('.dry'))).toBe('dry since 10:40');
  });

  it('says why a step is blocked while its surface is wet, and sends the reason for ticking early', async () => {
    const steps = [ticked(clear, '10:32'), ticked(table, '10:36', at('10:40')), linen];
    const { page, backend, fixture } = await render(exampleChecklist({ steps, now: at('10:38') }));
    const linenRow = row(page, 'linen');
    expect(text(linenRow.querySelector('.blocked'))).toBe('Needs table top and rails dry: wet until 10:40 (2:00 left)');
    expect(text(button(linenRow, 'button.tick'))).toBe('Tick early');
    button(linenRow, 'button.tick').click();
    await settle(fixture);
    backend.expectNone('/api/turnovers/9/steps/linen/done');
    expect(button(linenRow, 'button.tick').disabled).toBe(true);
    const reason = linenRow.querySelector<HTMLInputElement>('.reason input')!;
    reason.value = 'Next patient is on a stretcher, sheet goes on the dry half first';
    reason.dispatchEvent(new Event('input'));
    await settle(fixture);
    button(linenRow, 'button.tick').click();
    const request = backend.expectOne('/api/turnovers/9/steps/linen/done');
    expect(request.request.body).toEqual({ earlyReason: 'Next patient is on a stretcher, sheet goes on the dry half first' });
    await answer(fixture, request, exampleChecklist({ steps }));
  });

  it('shows the server refusing a tick in the page and then asks for a reason', async () => {
    // By this tablet's clock the table is dry at 10:38; the server's clock disagrees.
    const steps = [ticked(clear, '10:32'), ticked(table, '10:34', at('10:38')), linen];
    const { page, backend, fixture } = await render(exampleChecklist({ steps, now: at('10:38') }));
    expect(row(page, 'linen').querySelector('.blocked')).toBeNull();
    button(row(page, 'linen'), 'button.tick').click();
    backend
      .expectOne('/api/turnovers/9/steps/linen/done')
      .flush({ error: { code: 'surface_wet', message: 'Table top and rails stays wet until 10:38.', details: { wet: ['table'], wetUntil: at('10:38', '30'), problems: [] } } }, { status: 422, statusText: 'x' });
    await settle(fixture);
    expect(text(page.querySelector('[role="alert"]'))).toBe('Table top and rails stays wet until 10:38.');
    expect(row(page, 'linen').querySelector('.reason input')).not.toBeNull();
  });

  it('asks for a reason before closing while a surface is still wet, and sends it', async () => {
    const { page, backend, fixture } = await render(exampleChecklist({ steps: [ticked(clear, '10:32'), ticked(table, '10:34', at('10:59')), ticked(linen, '10:39')] }));
    expect(text(page.querySelector('tw-turnover-close'))).toContain('wet until 10:59');
    button(page, 'button.complete-turnover').click();
    await settle(fixture);
    backend.expectNone('/api/turnovers/9/complete');
    const input = page.querySelector('tw-turnover-close .override input') as HTMLInputElement;
    expect(text(page.querySelector('tw-turnover-close .override'))).toContain('Why close while surfaces are still wet?');
    input.value = 'Next patient is a stretcher transfer; table covered with a fresh sheet';
    input.dispatchEvent(new Event('input'));
    await settle(fixture);
    button(page, 'button.complete-turnover').click();
    const request = backend.expectOne('/api/turnovers/9/complete');
    expect(request.request.body).toEqual({ overrideReason: 'Next patient is a stretcher transfer; table covered with a fresh sheet' });
  });

  it('enables "Turnover complete" only when every step is done, then shows the room ready', async () => {
    const { page, backend, events, fixture } = await render(exampleChecklist({ steps: [ticked(clear, '10:32'), table, linen] }));
    expect(button(page, 'button.complete-turnover').disabled).toBe(true);
    expect(text(page.querySelector('tw-turnover-close .hint'))).toBe('2 steps still to do.');
    // every surface already dry (no wet-until), so closing needs no reason
    const allDone = exampleChecklist({ steps: [ticked(clear, '10:32'), ticked(table, '10:34'), ticked(linen, '10:39')] });
    // The day's stream says something changed (a colleague ticked the rest): the checklist is fetched again.
    events.sources[0].change({ kind: 'log', reason: 'step done' });
    await answer(fixture, backend.expectOne(checklistUrl(1)), allDone);
    expect(button(page, 'button.complete-turnover').disabled).toBe(false);
    button(page, 'button.complete-turnover').click();
    const request = backend.expectOne('/api/turnovers/9/complete');
    expect(request.request.body).toEqual({});
    await answer(fixture, request, { ...allDone, completedAt: at('10:40') });
    expect(text(page.querySelector('tw-turnover-close'))).toContain('Turnover complete at 10:40');
    expect(text(page.querySelector('tw-turnover-close tw-room-state-chip .word'))).toBe('ready');
  });

  it('asks for an override reason to close an airborne case before the air hold ends', async () => {
    const steps = [ticked(clear, '10:32'), ticked(table, '10:34', at('10:38')), ticked(linen, '10:39')];
    const airborne = exampleChecklist({ steps, precaution: 'airborne', airHoldMinutes: 70, airHoldUntil: at('11:40'), now: at('10:40') });
    const { page, backend, fixture } = await render(airborne);
    expect(text(page.querySelector('.air-hold'))).toBe('room stays empty until 11:40 (1:00:00 left)');
    expect(text(page.querySelector('tw-caution-note'))).toContain('well-mixed air');
    button(page, 'button.complete-turnover').click();
    await settle(fixture);
    backend.expectNone('/api/turnovers/9/complete');
    const reason = page.querySelector<HTMLInputElement>('.override input')!;
    reason.value = 'Infection prevention cleared the room by phone';
    reason.dispatchEvent(new Event('input'));
    await settle(fixture);
    button(page, 'button.complete-turnover').click();
    const request = backend.expectOne('/api/turnovers/9/complete');
    expect(request.request.body).toEqual({ overrideReason: 'Infection prevention cleared the room by phone' });
    await answer(fixture, request, { ...airborne, completedAt: at('10:41') });
  });

  it('opens on the room remembered on this device and remembers a room picked', async () => {
    localStorage.setItem(LAST_ROOM_KEY, '2');
    const { page, navigate } = await render(exampleChecklist({ roomId: 2, roomName: 'CT 2', modality: 'CT' }));
    const select = page.querySelector<HTMLSelectElement>('.room select')!;
    expect(select.value).toBe('2');
    expect(text(page.querySelector('tw-caution-note'))).not.toContain('Zone IV');
    select.value = '1';
    select.dispatchEvent(new Event('change'));
    expect(navigate).toHaveBeenCalledWith([], { queryParams: { room: '1' }, queryParamsHandling: 'merge' });
  });

  it('ticks off a shift task by its occurrence', async () => {
    const task = { taskId: 3, key: 'qa', label: 'Daily scanner QA', due: at('07:00'), durationMinutes: 10, doneAt: null, doneBy: null, overdue: true };
    const { page, backend, fixture } = await render(exampleChecklist({ tasks: [task] }), { room: '1' });
    expect(text(page.querySelector('tw-shift-task-list li'))).toContain('Overdue');
    button(page, 'button.task-done').click();
    const request = backend.expectOne('/api/shift-tasks/3/done');
    expect(request.request.body).toEqual({ due: at('07:00') });
    request.flush({ task: { ...task, doneAt: at('10:31'), doneBy: 'Robin Example', overdue: false } });
    await settle(fixture);
    expect(text(page.querySelector('tw-shift-task-list li'))).toContain('Done 10:31 by Robin Example');
  });
  it('explains that the opening is a preview, with no Done buttons and no close', async () => {
    const opening = exampleChecklist({ turnoverId: null, leaving: null, examEndedAt: null, now: at('06:50'), steps: [clear, table] });
    const { page } = await render(opening);
    expect(text(page.querySelector('.hint.opening'))).toContain('the first turnover starts when an exam is finished');
    expect(page.querySelector('button.tick')).toBeNull();
    expect(row(page, 'table').querySelector('select')).toBeNull();
    expect(page.querySelector('tw-turnover-close')).toBeNull();
    expect(text(row(page, 'table'))).toContain('planned');
  });

  it('keeps saying the turnover is complete after the checklist moves on to the next one', async () => {
    const steps = [ticked(clear, '10:32'), ticked(table, '10:34', at('10:38')), ticked(linen, '10:39')];
    const { page, backend, events, fixture } = await render(exampleChecklist({ steps, now: at('10:40') }));
    button(page, 'button.complete-turnover').click();
    await answer(fixture, backend.expectOne('/api/turnovers/9/complete'), exampleChecklist({ steps, completedAt: at('10:40') }));
    // The stream announces the completion; the room's checklist is now the next exam's, not yet finished.
    events.sources[0].change({ kind: 'board', reason: 'turnover complete' });
    const next = exampleChecklist({ turnoverId: null, examEndedAt: null, leaving: exampleChecklist().arriving, arriving: null });
    await answer(fixture, backend.expectOne(checklistUrl(1)), next);
    expect(text(page.querySelector('.closed-note'))).toBe('Turnover after ACC-2041 complete at 10:40: MR 1 shows ready on the board.');
    expect(page.querySelector('button.exam-finished')).not.toBeNull();
  });

  it('does not ask for a reason when the server says a needed step is not done yet', async () => {
    const { page, backend, fixture } = await render(exampleChecklist({ steps: [ticked(clear, '10:32'), table, linen] }));
    button(row(page, 'linen'), 'button.tick').click();
    backend
      .expectOne('/api/turnovers/9/steps/linen/done')
      .flush({ error: { code: 'steps_missing', message: 'Tick "Table top and rails" first.', details: { missing: ['table'], problems: [] } } }, { status: 422, statusText: 'x' });
    await settle(fixture);
    expect(text(page.querySelector('[role="alert"]'))).toBe('Tick "Table top and rails" first.');
    expect(row(page, 'linen').querySelector('.reason input')).toBeNull();
  });
});


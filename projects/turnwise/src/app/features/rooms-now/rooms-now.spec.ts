import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { Router, provideRouter } from '@angular/router';

import type { Board } from '@shared/api/board';
import { fakeAuth } from '../../../testing/fake-auth';
import type { Role } from '../../core/auth/roles';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { provideIcons } from '../../core/layout/icons';
import { ShellChrome } from '../../core/layout/shell-chrome';
import { fakeClock } from '../../core/time/testing/fake-clock';
import { fakeEventSources } from '../../core/live/testing/fake-event-source';
import { RoomsNow } from './rooms-now';
import { at, exampleBoard, exampleBoardRoom, exampleSlot } from './testing/example-board';

const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };
const BOARD_URL = (request: { url: string }) => /^\/api\/days\/\d{4}-\d{2}-\d{2}\/board$/.test(request.url);

// Invented: MR 1 turning over until 09:12 with its next patient waiting; MR 2 in exam, next at 09:30
// but ready only at 09:40; CT 3 closed.
const busyDay = exampleBoard([
  exampleBoardRoom(1, {
    state: 'turning over',
    readyAt: at('09:12'),
    current: exampleSlot(11, '08:20', '08:55'),
    next: exampleSlot(12, '09:15', '09:45', { arrivedAt: at('08:58') }),
    turnoverId: 5,
    tasks: [{ taskId: 3, key: 'qa', label: 'Daily scanner QA', due: at('07:00'), durationMinutes: 10, doneAt: null, doneBy: null, overdue: true }],
  }),
  exampleBoardRoom(2, {
    state: 'in exam',
    readyAt: at('09:40'),
    current: exampleSlot(21, '08:30', '09:20'),
    next: exampleSlot(22, '09:30', '10:00', { procedure: 'MR brain with contrast' }),
    runningLateMinutes: 10,
  }),
  exampleBoardRoom(3, { name: 'CT 3', modality: 'CT', state: 'closed' }),
]);

async function render(options: { role?: Role; display?: string; board?: Board } = {}) {
  const events = fakeEventSources();
  const clock = fakeClock(at('09:00'));
  TestBed.configureTestingModule({
    imports: [RoomsNow],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth({ username: 'robin', role: options.role ?? 'frontdesk' }).provider,
      events.provider,
      clock.provider,
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const navigate = jest.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
  const fixture = TestBed.createComponent(RoomsNow);
  if (options.display) fixture.componentRef.setInput('display', options.display);
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  await settle(fixture);
  backend.expectOne(BOARD_URL).flush(options.board ?? busyDay);
  await settle(fixture);
  return { fixture, backend, events, clock, navigate, page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<unknown>) {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

const text = (element: Element | null) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
const cards = (page: HTMLElement) => Array.from(page.querySelectorAll('tw-board-card'));

describe('RoomsNow', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('shows each room state as a word with an icon, not by colour alone', async () => {
    const { page } = await render();
    const chips = Array.from(page.querySelectorAll('tw-room-state-chip'));
    expect(chips.map((chip) => text(chip.querySelector('.word')))).toEqual(['turning over', 'in exam', 'closed']);
    for (const chip of chips) expect(chip.querySelector('mat-icon')).not.toBeNull();
    expect(text(chips[0])).toContain('the room is being cleaned');
  });

  it('shows ready-at, the countdown to it, the next slot and a waiting patient', async () => {
    const { page } = await render();
    const first = cards(page)[0];
    expect(text(first.querySelector('.ready dt'))).toBe('Ready at');
    expect(text(first.querySelector('.ready .time'))).toBe('09:12');
    // minutes, not a second clock time beside ready-at ("Ready at 09:12 in 12:00" read as two times)
    expect(text(first.querySelector('.countdown'))).toBe('in 12 min');
    expect(first.querySelector('.planned')).toBeNull(); // on plan: no second time beside it
    expect(text(first.querySelector('.next .time'))).toBe('09:15');
    expect(text(first.querySelector('.next .accession'))).toBe('ACC-1012');
    expect(text(first.querySelector('.next .procedure'))).toBe('MR knee without contrast');
    expect(text(first.querySelector('.waiting'))).toBe('Patient waiting since 08:58');
    expect(text(first.querySelector('.overdue'))).toBe('Overdue: Daily scanner QA (due 07:00)');
    // A room in exam does not count down: its ready-at moves with the exam's real end.
    expect(cards(page)[1].querySelector('.countdown')).toBeNull();
    // Only a room in exam says which exam is on; a turning-over room's current exam has left.
    expect(text(cards(page)[1].querySelector('.current .accession'))).toBe('ACC-1021');
    expect(text(cards(page)[1].querySelector('.current .ends'))).toBe('slot ends 09:20');
    expect(first.querySelector('.current')).toBeNull();
  });

  it('counts down with the clock and says when a room runs late', async () => {
    const { page, clock, fixture } = await render();
    clock.set(at('09:05'));
    await settle(fixture);
    expect(text(cards(page)[0].querySelector('.countdown'))).toBe('in 7 min');
    expect(text(cards(page)[1])).toContain('Running late by 10 min');
    expect(text(cards(page)[0])).not.toContain('Running late');
  });

  it('says "overdue by N min" once a turnover runs past its ready-at, instead of a stalled countdown', async () => {
    const { page, clock, fixture } = await render();
    clock.set(at('09:15:30'));
    await settle(fixture);
    expect(text(cards(page)[0].querySelector('.countdown'))).toBe('overdue by 4 min');
    expect(cards(page)[0].querySelector('.countdown.overdue-by')).not.toBeNull();
  });

  it('leads with the estimate when a turnover runs behind its plan, beside the plan, so "Running late" agrees with it', async () => {
    // Invented: planned ready 09:12, but the steps still to do end at 09:21; next patient 09:15.
    const behind = exampleBoard([exampleBoardRoom(1, { ...busyDay.rooms[0], expectedReadyAt: at('09:21'), runningLateMinutes: 6 })]);
    const { page } = await render({ board: behind });
    const card = cards(page)[0];
    expect(text(card.querySelector('.ready dt'))).toBe('Expected ready');
    expect(text(card.querySelector('.ready .time'))).toBe('09:21');
    expect(text(card.querySelector('.countdown'))).toBe('in 21 min');
    expect(text(card.querySelector('.planned'))).toBe('planned 09:12');
    expect(text(card)).toContain('Running late by 6 min');
  });

  it('lists the coming hour\'s arrivals across rooms and marks any of them arrived', async () => {
    const arrivals = [
      { ...exampleSlot(12, '09:15', '09:45', { arrivedAt: at('08:58') }), roomId: 1, roomName: 'MR 1' },
      { ...exampleSlot(22, '09:30', '10:00'), roomId: 2, roomName: 'MR 2' },
      { ...exampleSlot(23, '09:50', '10:20'), roomId: 2, roomName: 'MR 2' },
    ];
    const board = exampleBoard(busyDay.rooms, '09:00', arrivals);
    const { page, backend, fixture } = await render({ board });
    const rows = Array.from(page.querySelectorAll('tw-arrivals-list li'));
    expect(rows.map((li) => text(li.querySelector('.accession')))).toEqual(['ACC-1012', 'ACC-1022', 'ACC-1023']);
    expect(text(rows[0].querySelector('.waiting'))).toBe('Waiting since 08:58');
    // MR 2's second patient is not the room's next one: only this list lets the desk mark them
    rows[2].querySelector<HTMLButtonElement>('button.mark-arrived')!.click();
    const request = backend.expectOne('/api/exams/23/arrived');
    expect(request.request.method).toBe('POST');
    request.flush({ arrivedAt: at('09:01') });
    backend.expectOne(BOARD_URL).flush(board);
    await settle(fixture);
  });

  it('shows the state on the wall display as a band with its icon, and keeps a way out', async () => {
    const { page } = await render({ display: 'wall' });
    const band = cards(page)[0].querySelector('.state-band')!;
    expect(text(band.querySelector('.word'))).toBe('turning over');
    expect(band.querySelector('mat-icon')).not.toBeNull();
    expect(page.querySelector('tw-arrivals-list')).toBeNull();
    expect(page.querySelector('button.leave-wall')).not.toBeNull();
    // three rooms: two columns, so the cards fill the screen
    expect((page as HTMLElement).style.getPropertyValue('--wall-columns')).toBe('2');
  });

  it('marks the next patient arrived with one click, then shows the board again', async () => {
    const { page, backend, fixture } = await render();
    cards(page)[1].querySelector<HTMLButtonElement>('button.mark-arrived')!.click();
    const request = backend.expectOne('/api/exams/22/arrived');
    expect(request.request.method).toBe('POST');
    request.flush({ arrivedAt: at('09:01') });
    backend.expectOne(BOARD_URL).flush(busyDay);
    await settle(fixture);
  });

  it('undoes a mistaken arrival mark', async () => {
    const { page, backend, fixture } = await render({ role: 'charge' });
    cards(page)[0].querySelector<HTMLButtonElement>('button.undo-arrived')!.click();
    const request = backend.expectOne('/api/exams/12/arrived');
    expect(request.request.method).toBe('DELETE');
    request.flush(null);
    backend.expectOne(BOARD_URL).flush(busyDay);
    await settle(fixture);
  });

  it('offers no arrival button and no checklist link to a scheduler, who only reads', async () => {
    const { page } = await render({ role: 'scheduler' });
    expect(page.querySelector('button.mark-arrived, button.undo-arrived')).toBeNull();
    expect(page.querySelector('a.checklist-link')).toBeNull();
  });

  it('links each card to its checklist for a technologist, but not for the front desk', async () => {
    const tech = await render({ role: 'tech' });
    expect(tech.page.querySelectorAll('a.checklist-link')).toHaveLength(3);
    expect(tech.page.querySelector('a.checklist-link')!.getAttribute('href')).toBe('/turnover?room=1');
    TestBed.resetTestingModule();
    const desk = await render({ role: 'frontdesk' });
    expect(desk.page.querySelector('a.checklist-link')).toBeNull();
  });

  it('in wall display mode hides the navigation and every control, and shows them again when left', async () => {
    const { page, fixture } = await render({ role: 'admin', display: 'wall' });
    expect(TestBed.inject(ShellChrome).hidden()).toBe(true);
    expect(page.querySelector('button.mark-arrived, button.undo-arrived, a.checklist-link, button.enter-wall')).toBeNull();
    expect(text(page)).toContain('turning over');
    fixture.destroy();
    expect(TestBed.inject(ShellChrome).hidden()).toBe(false);
  });

  it('asks for wall display through the URL, so a wall screen can be bookmarked', async () => {
    const { page, navigate } = await render();
    page.querySelector<HTMLButtonElement>('button.enter-wall')!.click();
    expect(navigate).toHaveBeenCalledWith([], { queryParams: { display: 'wall' }, queryParamsHandling: 'merge' });
  });

  it('fetches the board again on each change event of the day and says it is live', async () => {
    const { page, backend, events, fixture } = await render();
    const source = events.sources[0];
    expect(source.url).toMatch(/\/api\/days\/\d{4}-\d{2}-\d{2}\/events$/);
    source.open();
    await settle(fixture);
    expect(text(page.querySelector('tw-live-indicator'))).toBe('Live');
    source.change({ kind: 'board', reason: 'arrived' });
    const ready = exampleBoard([exampleBoardRoom(1, { state: 'ready', readyAt: at('09:10') })], '09:11');
    backend.expectOne(BOARD_URL).flush(ready);
    await settle(fixture);
    expect(text(page.querySelector('tw-room-state-chip .word'))).toBe('ready');
  });

  it('shows a failed board fetch in the page', async () => {
    const { page, backend, events, fixture } = await render();
    events.sources[0].change();
    backend.expectOne(BOARD_URL).flush({ error: { code: 'internal', message: 'The board could not be computed.' } }, { status: 500, statusText: 'x' });
    await settle(fixture);
    expect(text(page.querySelector('[role="alert"]'))).toBe('The board could not be computed.');
  });
});

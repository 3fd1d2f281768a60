import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { By } from '@angular/platform-browser';

import { DayTimeline } from './day-timeline';
import { block, dayPlan, renderDay, settle, text } from './testing/day-plan-harness';

const at = (hhmm: string) => `2027-03-15T${hhmm}:00-05:00`;
const key = (target: HTMLElement, key: string, extra: KeyboardEventInit = {}) =>
  target.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true, cancelable: true, ...extra }));
/** jsdom has no PointerEvent; the timeline reads only what MouseEvent carries too. */
const pointer = (target: EventTarget, type: string, clientX: number, clientY: number) =>
  target.dispatchEvent(new MouseEvent(type, { bubbles: true, cancelable: true, button: 0, clientX, clientY }));

describe('DayTimeline now line', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('is drawn across the lanes on today, but not across the room names once the lanes scroll past it', async () => {
    const { fixture, page } = await renderDay({ now: at('09:00') });
    const line = () => page.querySelector<HTMLElement>('tw-day-timeline .now-line');
    expect(line()).not.toBeNull();
    // Its place along the time axis, from the left of the lanes (the 172 px room names before it).
    const x = parseFloat(line()!.style.left) - 172;
    const scroller = page.querySelector<HTMLElement>('tw-day-timeline .scroller')!;
    scroller.scrollLeft = x + 40;
    scroller.dispatchEvent(new Event('scroll'));
    await settle(fixture);
    expect(line()).toBeNull();
    scroller.scrollLeft = Math.max(0, x - 40);
    scroller.dispatchEvent(new Event('scroll'));
    await settle(fixture);
    expect(line()).not.toBeNull();
  });
});

describe('DayTimeline moves', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('sends the drop of a slot as PATCH with the exam version and reason drag, and shows the answer', async () => {
    const { fixture, backend, page } = await renderDay();
    const timeline = fixture.debugElement.query(By.directive(DayTimeline)).componentInstance as DayTimeline;
    void timeline.drop(2, 1, Date.parse(at('08:55')));
    const request = backend.expectOne({ method: 'PATCH', url: '/api/exams/2' });
    expect(request.request.body).toEqual({ start: at('08:55'), roomId: 1, version: 1, reason: 'drag' });
    const moved = dayPlan();
    moved.rooms[0].exams[1] = { ...moved.rooms[0].exams[1], start: at('08:55'), end: at('09:25'), version: 2 };
    request.flush(moved);
    await settle(fixture);
    expect(block(page, 2).getAttribute('aria-label')).toContain('08:55–09:25');
  });

  it('drags a block with the pointer: 10 minutes right snaps to +10 min, previews the verdicts, then saves', async () => {
    const { fixture, backend, page } = await renderDay();
    // No layout in jsdom: the lanes start at y = 0, and 1000 px − the 172 px lane header show 4 h.
    const pxPerMinute = (1000 - 172) / 240;
    pointer(block(page, 2), 'pointerdown', 300, 20);
    pointer(window, 'pointermove', 300 + 9.2 * pxPerMinute, 22);
    pointer(window, 'pointerup', 300 + 9.2 * pxPerMinute, 22);
    await settle(fixture);
    // 25 min for a turnover that needs 25: under the 3-min snug margin, so snug (product brief verdict rule).
    expect(text(page.querySelector('.move-status'))).toBe('ACC-2 to MR 1 at 08:55 — gap before: snug — gap after: short by 5 min');
    const request = backend.expectOne({ method: 'PATCH', url: '/api/exams/2' });
    expect(request.request.body).toEqual({ start: at('08:55'), roomId: 1, version: 1, reason: 'drag' });
    request.flush(dayPlan());
    await settle(fixture);
    expect(text(page.querySelector('.move-status'))).toBe('');
  });

  it('says why a lane of another modality refuses the slot, in the drag line and after the drop, and moves nothing', async () => {
    const { fixture, backend, page } = await renderDay();
    // Lanes are 104 px high from y = 0 (no layout in jsdom): y = 130 is the second lane, CT 1.
    pointer(block(page, 2), 'pointerdown', 300, 20);
    pointer(window, 'pointermove', 300, 130);
    // The drag draws once per animation frame: wait for that frame, not for a time.
    await new Promise<void>((resolve) => requestAnimationFrame(() => resolve()));
    await settle(fixture);
    const why = 'ACC-2 stays in MR 1: CT 1 takes CT exams only, and ACC-2 is MR.';
    expect(text(page.querySelector('.move-status'))).toBe(why);
    pointer(window, 'pointerup', 300, 130);
    await settle(fixture);
    backend.expectNone('/api/exams/2');
    expect(text(page.querySelector('.notice[role="alert"]'))).toContain(why);
    expect(block(page, 2).closest('[data-room-id]')!.getAttribute('data-room-id')).toBe('1');
  });

  it('treats a press without movement as a click, not a move', async () => {
    const { fixture, backend, page } = await renderDay();
    pointer(block(page, 2), 'pointerdown', 300, 20);
    pointer(window, 'pointerup', 301, 21);
    await settle(fixture);
    backend.expectNone('/api/exams/2');
  });

  describe('opening an exam from its block', () => {
    const opened = (fixture: Awaited<ReturnType<typeof renderDay>>['fixture']) => {
      const timeline = fixture.debugElement.query(By.directive(DayTimeline)).componentInstance as DayTimeline;
      const ids: number[] = [];
      timeline.examOpened.subscribe((exam) => ids.push(exam.id));
      return ids;
    };

    it('opens the exam on a click that does not move it, the first of its lane too', async () => {
      const { fixture, backend, page } = await renderDay();
      const ids = opened(fixture);
      pointer(block(page, 1), 'pointerdown', 200, 20);
      pointer(window, 'pointerup', 201, 21);
      pointer(block(page, 1), 'click', 201, 21);
      await settle(fixture);
      expect(ids).toEqual([1]);
      backend.expectNone('/api/exams/1');
    });

    it('does not open the exam after a drag', async () => {
      const { fixture, backend, page } = await renderDay();
      const ids = opened(fixture);
      pointer(block(page, 2), 'pointerdown', 300, 20);
      pointer(window, 'pointermove', 340, 22);
      await new Promise<void>((resolve) => requestAnimationFrame(() => resolve()));
      pointer(window, 'pointerup', 340, 22);
      pointer(block(page, 2), 'click', 340, 22);
      await settle(fixture);
      expect(ids).toEqual([]);
      backend.expectOne({ method: 'PATCH', url: '/api/exams/2' }).flush(dayPlan());
      await settle(fixture);
    });

    it('opens the focused exam with Enter or Space when no move is under way; with a keyboard move, Enter saves it', async () => {
      const { fixture, backend, page } = await renderDay();
      const ids = opened(fixture);
      key(block(page, 1), 'Enter');
      key(block(page, 3), ' ');
      expect(ids).toEqual([1, 3]);
      key(block(page, 2), 'ArrowRight');
      await settle(fixture);
      key(block(page, 2), 'Enter');
      expect(ids).toEqual([1, 3]);
      backend.expectOne({ method: 'PATCH', url: '/api/exams/2' }).flush(dayPlan());
      await settle(fixture);
    });

    it('opens the exam for a read-only role too (Enter and click), moving nothing', async () => {
      const { fixture, backend, page } = await renderDay({ user: { username: 'tech', role: 'tech' } });
      const ids = opened(fixture);
      expect(block(page, 1).getAttribute('aria-describedby')).toBe('tw-open-hint');
      key(block(page, 1), 'ArrowRight');
      key(block(page, 1), 'Enter');
      pointer(block(page, 2), 'pointerdown', 300, 20);
      pointer(block(page, 2), 'click', 300, 20);
      await settle(fixture);
      expect(ids).toEqual([1, 2]);
      backend.expectNone((request) => request.method === 'PATCH');
    });
  });

  it('moves the focused block 5 min per arrow and saves with Enter as reason keyboard', async () => {
    const { fixture, backend, page } = await renderDay();
    key(block(page, 2), 'ArrowRight');
    await settle(fixture);
    key(block(page, 2), 'ArrowRight');
    await settle(fixture);
    expect(text(page.querySelector('.move-status'))).toContain('ACC-2 to MR 1 at 08:55');
    expect(block(page, 2).classList).toContain('moving');
    expect(document.activeElement).toBe(block(page, 2));
    key(block(page, 2), 'Enter');
    const request = backend.expectOne({ method: 'PATCH', url: '/api/exams/2' });
    expect(request.request.body).toEqual({ start: at('08:55'), roomId: 1, version: 1, reason: 'keyboard' });
    request.flush(dayPlan());
    await settle(fixture);
  });

  it('cancels a keyboard move with Escape, without a request', async () => {
    const { fixture, backend, page } = await renderDay();
    key(block(page, 2), 'ArrowLeft');
    await settle(fixture);
    expect(block(page, 2).getAttribute('aria-label')).toContain('08:40–09:10');
    key(block(page, 2), 'Escape');
    await settle(fixture);
    expect(block(page, 2).getAttribute('aria-label')).toContain('08:45–09:15');
    key(block(page, 2), 'Enter');
    await settle(fixture);
    backend.expectNone('/api/exams/2');
  });

  it('moves to the next lane of the same modality with Alt+Down, skipping the CT room', async () => {
    const { fixture, backend, page } = await renderDay();
    key(block(page, 2), 'ArrowDown', { altKey: true });
    await settle(fixture);
    expect(block(page, 2).closest('[data-room-id]')!.getAttribute('data-room-id')).toBe('2');
    expect(document.activeElement).toBe(block(page, 2));
    key(block(page, 2), 'Enter');
    expect(backend.expectOne('/api/exams/2').request.body).toEqual({ start: at('08:45'), roomId: 2, version: 1, reason: 'keyboard' });
  });

  it('on 409, shows the server\'s message and reloads the day', async () => {
    const { fixture, backend, page } = await renderDay();
    const timeline = fixture.debugElement.query(By.directive(DayTimeline)).componentInstance as DayTimeline;
    void timeline.drop(2, 1, Date.parse(at('09:00')));
    const message = 'Exam ACC-2 was changed meanwhile: Sam changed it at 07:50 (Moved ACC-2). The day has been reloaded.';
    backend.expectOne('/api/exams/2').flush({ error: { code: 'stale_version', message } }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/plan').flush(dayPlan());
    await settle(fixture);
    expect(text(page.querySelector('.notice[role="alert"]'))).toContain(message);
  });

  it('on 422, shows the message and the block snaps back', async () => {
    const { fixture, backend, page } = await renderDay();
    const timeline = fixture.debugElement.query(By.directive(DayTimeline)).componentInstance as DayTimeline;
    void timeline.drop(2, 1, Date.parse(at('09:00')));
    await settle(fixture);
    expect(block(page, 2).getAttribute('aria-label')).toContain('09:00–09:30');
    backend
      .expectOne('/api/exams/2')
      .flush({ error: { code: 'validation_failed', message: 'A move must keep ACC-2 within 2027-03-15.' } }, { status: 422, statusText: 'Unprocessable' });
    await settle(fixture);
    expect(text(page.querySelector('.notice'))).toContain('A move must keep ACC-2 within 2027-03-15.');
    expect(block(page, 2).getAttribute('aria-label')).toContain('08:45–09:15');
    backend.expectNone('/api/days/2027-03-15/plan');
  });
});

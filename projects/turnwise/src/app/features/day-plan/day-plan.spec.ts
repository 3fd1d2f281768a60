import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { DateTime } from 'luxon';

import type { Fix } from '@shared/fixes/model';
import { examplePlan, exampleRoom } from './testing/example-plan';
import { DAY_INPUT, FakeEventSource, answerHistory, block, dayPlan, marker, renderDay, settle, text } from './testing/day-plan-harness';

const fix = (id: string, newProblems: number): Fix => ({
  id,
  kind: 'push-later',
  toExamId: 2,
  title: `Start ACC-2 10 min later (${id})`,
  detail: 'ACC-2 and 1 later exam in MR 1 move 10 min later.',
  changes: [],
  effect: {
    verdictAfter: 'fits',
    shortByAfter: 0,
    newProblems,
    dayEndsBefore: '2027-03-15T10:15:00-05:00',
    dayEndsAfter: '2027-03-15T10:25:00-05:00',
    summaryAfter: { fits: 6, snug: 0, short: 0, overlap: 0, minutesShort: 0 },
  },
});

describe('DayPlan timeline', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('marks each gap with its verdict icon and word, and says what a short gap needs and has', async () => {
    const { page } = await renderDay();
    const short = marker(page, 2);
    // One person, coil change: 22 min (product brief check value), plus 3 min injector prep for contrast.
    expect(short.getAttribute('aria-label')).toBe('Turnover before ACC-2: short by 10 min, needs 25, has 15');
    expect(short.querySelector('mat-icon')!.getAttribute('data-mat-icon-name')).toBe('warning');
    expect(marker(page, 3).getAttribute('aria-label')).toBe('Turnover before ACC-3: fits, needs 25, has 30');
    expect(marker(page, 1).getAttribute('aria-label')).toContain('Opening before ACC-1: fits');
    expect(text(marker(page, 3))).toBe('fits');
  });

  it('shows the words "short by N min" in the marker when the gap is wide enough', async () => {
    const { page, fixture } = await renderDay();
    page.querySelectorAll<HTMLButtonElement>('.zoom button')[3].click(); // 1 h per screen
    await settle(fixture);
    expect(text(marker(page, 2).querySelector('.word'))).toBe('short');
    expect(text(marker(page, 2).querySelector('.short-by'))).toBe('short by 10 min');
  });

  it('draws the turnover as hands-on, wet/dry and air-hold parts, each with its label', async () => {
    const { page } = await renderDay();
    const band = marker(page, 21).closest('tw-gap-marker')!.querySelector('.band')!;
    const parts = Array.from(band.querySelectorAll('.segment')).map((s) => `${s.getAttribute('data-part')}: ${s.getAttribute('title')}`);
    // Airborne in a 6-ACH room holds the room 70 min (product brief; CDC 2003 guideline, Appendix B, Table B.1 gives 69).
    expect(parts[0]).toMatch(/^hands-on: hands-on \d+ min$/);
    expect(parts[parts.length - 1]).toMatch(/^air-hold: air hold \d+ min$/);
    expect(marker(page, 21).getAttribute('aria-label')).toContain('air hold 70 min');
    expect(Array.from(page.querySelectorAll('tw-band-legend li')).map(text)).toEqual(['hands-on', 'wet / dry time', 'air hold']);
  });

  it('labels each exam block with room, times, accession, procedure and precaution', async () => {
    const { page } = await renderDay();
    expect(block(page, 2).getAttribute('aria-label')).toBe(
      'MR 1, ACC-2, MR brain with contrast, 08:45–09:15, contact precautions, head coil, contrast',
    );
    expect(block(page, 2).getAttribute('tabindex')).toBe('0');
  });

  it('shows the summary and, per lane, staff and the first and last slot', async () => {
    const { page } = await renderDay();
    const bar = Array.from(page.querySelectorAll('tw-verdict-summary li')).map(
      (item) => `${text(item.querySelector('.count'))} ${text(item.querySelector('.word')) || 'min short in all'}`,
    );
    expect(bar).toEqual(['0 overlap', '1 short', '0 snug', '5 fits', '10 min short in all']);
    const lane = text(page.querySelector('[data-room-id="1"] .header'));
    expect(lane).toContain('MR 1');
    expect(lane).toContain('1 person');
    expect(lane).toContain('08:00–10:15');
    expect(lane).toContain('1 to check');
  });

  it('dims fitting gaps and the exams around them when only problem gaps are asked for', async () => {
    const { page, fixture } = await renderDay();
    page.querySelector<HTMLButtonElement>('mat-slide-toggle button')!.click();
    await settle(fixture);
    expect(marker(page, 3).closest('tw-gap-marker')!.classList).toContain('dimmed');
    expect(marker(page, 2).closest('tw-gap-marker')!.classList).not.toContain('dimmed');
    expect(block(page, 21).classList).toContain('dimmed');
    expect(block(page, 2).classList).not.toContain('dimmed');
  });

  it('opens a gap in the side panel: needs, has, ready-at, steps with times and people', async () => {
    const { page, fixture, backend } = await renderDay();
    marker(page, 2).click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [] });
    await settle(fixture);
    const panel = page.querySelector('tw-gap-panel')!;
    expect(text(panel.querySelector('h2'))).toBe('Turnover before ACC-2');
    expect(text(panel)).toContain('short by 10 min');
    const facts = Array.from(panel.querySelectorAll('.facts dt, .facts dd')).map(text);
    expect(facts).toEqual(['Needs', '25 min', 'Has', '15 min', 'Ready at', '08:55', 'People', '1 (room default)']);
    const first = panel.querySelector('.steps li')!;
    expect(text(first.querySelector('.time'))).toBe('08:30–08:33');
    expect(text(first.querySelector('.label'))).toBe('Patient out; coil, pads and linen off');
    expect(panel.querySelector('.steps .person')).toBeNull();
    expect(text(panel.querySelector('tw-caution-note'))).toContain('Zone IV');
    expect(text(panel)).toContain('No fix found for this gap');
  });

  it('lists the fixes for the gap and applies one with POST, asking first when it makes other gaps short', async () => {
    const { page, fixture, backend } = await renderDay();
    marker(page, 2).click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [fix('push-later:2', 0), fix('add-helper:2', 2)] });
    await settle(fixture);
    const cards = Array.from(page.querySelectorAll('tw-fix-card'));
    expect(cards).toHaveLength(2);
    expect(text(cards[0])).toContain('Day ends 10:15 → 10:25');
    expect(text(cards[1])).toContain('Makes 2 other gaps short');

    cards[0].querySelector<HTMLButtonElement>('button.apply')!.click();
    const first = backend.expectOne('/api/days/2027-03-15/fixes/apply');
    expect(first.request.body).toEqual({ fixId: 'push-later:2', acceptNewProblems: false });
    first.flush({ applied: fix('push-later:2', 0), plan: dayPlan() });
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [fix('add-helper:2', 2)] });
    await settle(fixture);

    page.querySelector<HTMLButtonElement>('tw-fix-card button.apply')!.click();
    await settle(fixture);
    backend.expectNone('/api/days/2027-03-15/fixes/apply');
    expect(text(page.querySelector('tw-fix-card .confirm'))).toContain('makes 2 other gaps short');
    page.querySelector<HTMLButtonElement>('tw-fix-card button.apply-anyway')!.click();
    expect(backend.expectOne('/api/days/2027-03-15/fixes/apply').request.body).toEqual({ fixId: 'add-helper:2', acceptNewProblems: true });
  });

  it('sets the people on one turnover, and the room default, for a charge technologist', async () => {
    const { page, fixture, backend } = await renderDay();
    marker(page, 2).click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [] });
    const toggles = Array.from(page.querySelectorAll<HTMLButtonElement>('tw-gap-panel mat-button-toggle button'));
    expect(toggles.map(text)).toEqual(['Room default (1)', '1', '2', '3']);
    toggles[2].click();
    const put = backend.expectOne('/api/exams/2/staffing');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ staff: 2 });
    put.flush(dayPlan({ ...DAY_INPUT, staffOverrides: { 2: 2 } }));
    await settle(fixture);
    backend.match('/api/days/2027-03-15/fixes?gap=2');
    await settle(fixture);
    const panel = page.querySelector('tw-gap-panel')!;
    expect(text(panel.querySelectorAll('.facts dd')[3])).toBe('2 (set for this gap)');
    const people = new Set(Array.from(panel.querySelectorAll('.steps .person')).map(text));
    expect(people).toEqual(new Set(['person 1', 'person 2']));

    page.querySelector<HTMLButtonElement>('[data-room-id="2"] button.more')!.click();
    const patch = backend.expectOne('/api/rooms/2/staffing');
    expect(patch.request.body).toEqual({ staff: 2 });
    patch.flush({ rooms: [] });
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/plan').flush(dayPlan());
    await settle(fixture);
    backend.match('/api/days/2027-03-15/fixes?gap=2');
  });

  for (const role of ['tech', 'frontdesk'] as const) {
    it(`gives ${role} a read-only timeline: nothing to drag, no undo, no staffing, no Apply`, async () => {
      const { page, fixture, backend } = await renderDay({ user: { username: role, role } });
      expect(page.querySelectorAll('tw-exam-block.movable')).toHaveLength(0);
      expect(block(page, 2).getAttribute('aria-describedby')).toBe('tw-open-hint');
      expect(page.querySelector('button.undo')).toBeNull();
      expect(page.querySelector('button.redo')).toBeNull();
      expect(page.querySelector('button.add-exam')).toBeNull();
      expect(page.querySelector('.header .staff button')).toBeNull();
      block(page, 2).dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
      block(page, 2).dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
      document.dispatchEvent(new KeyboardEvent('keydown', { key: 'z', ctrlKey: true, bubbles: true }));
      marker(page, 2).click();
      await settle(fixture);
      backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [fix('push-later:2', 0)] });
      await settle(fixture);
      expect(text(page.querySelector('tw-fix-card'))).toContain('Start ACC-2 10 min later');
      expect(page.querySelector('tw-fix-card button')).toBeNull();
      expect(page.querySelector('tw-gap-panel mat-button-toggle-group')).toBeNull();
      expect(page.querySelector('button.edit-exam')).toBeNull();
    });
  }

  it('offers Add exam, and Edit or cancel on the open gap’s exam, to a role that may move slots', async () => {
    const { page, fixture, backend } = await renderDay();
    expect(page.querySelector('button.add-exam')).not.toBeNull();
    marker(page, 2).click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [] });
    await settle(fixture);
    expect(text(page.querySelector('button.edit-exam'))).toContain('ACC-2');
  });

  it('opens the first exam of a lane from its block in the exam dialog, to edit or cancel it', async () => {
    const { page, fixture, backend } = await renderDay();
    block(page, 1).dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true, cancelable: true }));
    await settle(fixture);
    const dialog = document.querySelector('tw-exam-dialog')!;
    expect(text(dialog.querySelector('h2'))).toBe('Edit ACC-1');
    expect(dialog.querySelector<HTMLInputElement>('input[formcontrolname="accession"]')!.value).toBe('ACC-1');
    expect(text(dialog.querySelector('button.cancel-exam'))).toBe('Cancel exam ACC-1');
    expect(dialog.querySelector('button.save')).not.toBeNull();
    backend.expectNone((request) => request.method !== 'GET');
  });

  it('shows a read-only role the exam from its block, with nothing to save or cancel', async () => {
    const { page, fixture } = await renderDay({ user: { username: 'frontdesk', role: 'frontdesk' } });
    block(page, 1).dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true, cancelable: true }));
    await settle(fixture);
    const dialog = document.querySelector('tw-exam-dialog')!;
    expect(text(dialog.querySelector('h2'))).toBe('ACC-1');
    expect(text(dialog.querySelector('.read-only'))).toContain('read-only');
    expect(dialog.querySelector<HTMLInputElement>('input[formcontrolname="accession"]')!.disabled).toBe(true);
    expect(dialog.querySelector('button.save')).toBeNull();
    expect(dialog.querySelector('button.cancel-exam')).toBeNull();
  });

  it('undoes and redoes through the server, by button and by Ctrl+Z / Ctrl+Shift+Z', async () => {
    const { page, fixture, backend } = await renderDay();
    page.querySelector<HTMLButtonElement>('button.undo')!.click();
    backend.expectOne({ method: 'POST', url: '/api/days/2027-03-15/undo' }).flush(dayPlan());
    await settle(fixture);
    document.body.dispatchEvent(new KeyboardEvent('keydown', { key: 'Z', ctrlKey: true, shiftKey: true, bubbles: true }));
    backend.expectOne({ method: 'POST', url: '/api/days/2027-03-15/redo' }).flush(
      { error: { code: 'nothing_to_redo', message: 'You have nothing to redo on this day.' } },
      { status: 409, statusText: 'Conflict' },
    );
    await settle(fixture);
    expect(text(page.querySelector('.notice'))).toContain('You have nothing to redo on this day.');
    backend.expectOne('/api/days/2027-03-15/plan').flush(dayPlan());
    document.body.dispatchEvent(new KeyboardEvent('keydown', { key: 'z', ctrlKey: true, bubbles: true }));
    backend.expectOne({ method: 'POST', url: '/api/days/2027-03-15/undo' }).flush(dayPlan());
    await settle(fixture);
  });

  it('shows the day\'s changes in the history panel: site time, who, summary, reason', async () => {
    const { page, fixture } = await renderDay({
      history: {
        changes: [
          { id: 4, day: '2027-03-15', username: 'sam', displayName: 'Sam Scheduler', reason: 'drag', summary: 'Moved ACC-2 from MR 1 08:45 to 08:55', changes: [], revertsId: null, undone: false, afterManualChange: false, at: '2027-03-15T07:58:00-05:00' },
        ],
      },
    });
    page.querySelector<HTMLButtonElement>('button.history')!.click();
    await settle(fixture);
    const row = page.querySelector('tw-history-panel li')!;
    expect(['.when', '.who', '.what', '.how'].map((part) => text(row.querySelector(part)))).toEqual([
      '07:58', 'Sam Scheduler', 'Moved ACC-2 from MR 1 08:45 to 08:55', 'dragged',
    ]);
    expect(row.querySelector('.after-manual')).toBeNull();
  });

  it('marks an exam the booking system moved after a manual change: icon and words on its block, its label and in the history', async () => {
    const move = { type: 'move' as const, examId: 2, accession: 'ACC-2', from: { roomId: 1, start: '2027-03-15T08:55:00-05:00' }, to: { roomId: 1, start: '2027-03-15T09:10:00-05:00' } };
    const { page, fixture } = await renderDay({
      history: {
        changes: [
          {
            id: 5, day: '2027-03-15', username: 'hl7-feed', displayName: 'Booking system (HL7)', reason: 'hl7', changes: [move], revertsId: null, undone: false, afterManualChange: true,
            summary: 'Edited ACC-2: MR 1 08:55 → 09:10 (moved by the booking system after a manual change)', at: '2027-03-15T08:01:00-05:00',
          },
        ],
      },
    });
    const words = 'moved by the booking system after a manual change';
    expect(block(page, 2).getAttribute('aria-label')).toContain(words);
    expect(block(page, 2).getAttribute('title')).toContain(words);
    expect(block(page, 2).querySelector('.flags li.booking mat-icon')).not.toBeNull();
    expect(block(page, 1).getAttribute('aria-label')).not.toContain(words);
    page.querySelector<HTMLButtonElement>('button.history')!.click();
    await settle(fixture);
    const row = page.querySelector('tw-history-panel li')!;
    expect(text(row.querySelector('.what'))).toBe('Edited ACC-2: MR 1 08:55 → 09:10');
    expect(text(row.querySelector('.after-manual'))).toBe(words);
    expect(row.querySelector('.after-manual mat-icon')).not.toBeNull();
  });

  it('disables Undo and Redo when the server says the user has nothing to undo or redo', async () => {
    const { page } = await renderDay({ history: { canUndo: false, canRedo: false } });
    expect(page.querySelector<HTMLButtonElement>('button.undo')!.disabled).toBe(true);
    expect(page.querySelector<HTMLButtonElement>('button.redo')!.disabled).toBe(true);
  });

  it('asks again after each change and each live event, and enables Undo / Redo as the answer says', async () => {
    const { page, fixture, backend } = await renderDay({ history: { canUndo: false, canRedo: false } });
    const undo = () => page.querySelector<HTMLButtonElement>('button.undo')!;
    const redo = () => page.querySelector<HTMLButtonElement>('button.redo')!;
    // A move of the user's own: now there is something to undo.
    answerHistory({ canUndo: true });
    page.querySelector<HTMLButtonElement>('button.history')!.click(); // any later refetch also feeds the panel
    await settle(fixture);
    const stream = FakeEventSource.last!;
    stream.onopen!();
    stream.emit({ date: '2027-03-15', kind: 'plan', reason: 'drag', by: 'Jo Charge', at: '2027-03-15T08:00:00-05:00' });
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/plan').flush(dayPlan());
    await settle(fixture);
    expect([undo().disabled, redo().disabled]).toEqual([false, true]);
    // Undone: now only a redo.
    answerHistory({ canUndo: false, canRedo: true });
    undo().click();
    backend.expectOne({ method: 'POST', url: '/api/days/2027-03-15/undo' }).flush(dayPlan());
    await settle(fixture);
    expect([undo().disabled, redo().disabled]).toEqual([true, false]);
  });

  it('refetches the day on a change from the event stream and says who made it', async () => {
    const { page, fixture, backend } = await renderDay();
    const stream = FakeEventSource.last!;
    expect(stream.url).toBe('/api/days/2027-03-15/events');
    stream.onopen!();
    await settle(fixture);
    expect(text(page.querySelector('.live'))).toBe('Live');
    stream.emit({ date: '2027-03-15', kind: 'plan', reason: 'drag', by: 'Sam Scheduler', at: '2027-03-15T08:00:00Z' });
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/plan').flush(dayPlan());
    await settle(fixture);
    expect(text(page.querySelector('.live'))).toContain('Updated by Sam Scheduler');

    stream.emit({ date: '2027-03-15', kind: 'plan', reason: 'drag', by: 'Jo Charge', at: '2027-03-15T08:01:00Z' });
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/plan').flush(dayPlan());
    fixture.destroy();
    expect(stream.closed).toBe(true);
  });

  it('shows an empty day with a link to Import for a role that may import', async () => {
    const { page } = await renderDay({ plan: examplePlan([exampleRoom([], [])]) });
    expect(text(page)).toContain('No exams on this day yet');
    expect(page.querySelector('a[href^="/import"]')?.getAttribute('href')).toBe('/import?date=2027-03-15');
  });

  it('shows the server message when the plan cannot be loaded, and tries again on request', async () => {
    const { page, fixture, backend } = await renderDay({ plan: null });
    backend.expectOne('/api/days/2027-03-15/plan').error(new ProgressEvent('error'));
    await settle(fixture);
    expect(text(page.querySelector('[role="alert"]'))).toContain('cannot reach its server');
    page.querySelector<HTMLButtonElement>('button.retry')!.click();
    backend.expectOne('/api/days/2027-03-15/plan').flush(dayPlan());
    await settle(fixture);
    expect(page.querySelectorAll('tw-exam-block')).toHaveLength(6);
  });

  it('without a date, shows today in the site zone', async () => {
    const { backend, page, fixture } = await renderDay({ date: '', plan: null });
    const today = DateTime.now().setZone('America/Chicago').toISODate();
    backend.expectOne(`/api/days/${today}/plan`).flush({ ...examplePlan([]), date: today });
    await settle(fixture);
    expect(page.querySelector<HTMLInputElement>('input[type="date"]')!.value).toBe(today);
  });
});

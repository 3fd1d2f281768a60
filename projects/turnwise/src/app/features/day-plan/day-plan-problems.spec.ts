import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { DAY_INPUT, dayPlan, marker, renderDay, settle, text } from './testing/day-plan-harness';

const at = (hhmm: string) => `2027-03-15T${hhmm}:00-05:00`;
/** The example day with ACC-21 at 09:00, inside the air hold after the airborne ACC-20: two problems. */
const twoProblems = () => dayPlan({ ...DAY_INPUT, exams: DAY_INPUT.exams.map((e) => (e.id === 21 ? { ...e, start: at('09:00') } : e)) });
const key = (k: string) => document.body.dispatchEvent(new KeyboardEvent('keydown', { key: k, bubbles: true }));

describe('DayPlan problem gaps and patients to call', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('steps through the problem gaps in time order with the buttons and with ] and [, opening each', async () => {
    const { page, fixture, backend } = await renderDay({ plan: twoProblems() });
    // ACC-2 short (08:45, MR 1), then ACC-21 inside an air hold (09:00, MR 2).
    expect(text(page.querySelector('.problem-steps .where'))).toBe('2 gaps to check');
    page.querySelector<HTMLButtonElement>('button.next-problem')!.click();
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('.problem-steps .where'))).toBe('Problem 1 of 2');
    expect(text(page.querySelector('tw-gap-panel h2'))).toContain('ACC-2');
    expect(document.activeElement).toBe(marker(page, 2));
    key(']');
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('.problem-steps .where'))).toBe('Problem 2 of 2');
    expect(document.activeElement).toBe(marker(page, 21));
    key('[');
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('.problem-steps .where'))).toBe('Problem 1 of 2');
  });

  it('on today, starts stepping from now: the first problem still ahead, not the morning\'s that is over', async () => {
    // At 08:50 ACC-2's gap (into 08:45) has gone by; ACC-21's (09:00) is still ahead.
    const { page, fixture, backend } = await renderDay({ plan: twoProblems(), now: at('08:50') });
    expect(text(page.querySelector('.problem-steps .where'))).toBe('2 gaps to check, 1 still ahead');
    page.querySelector<HTMLButtonElement>('button.next-problem')!.click();
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('.problem-steps .where'))).toBe('Problem 2 of 2');
    expect(text(page.querySelector('tw-gap-panel h2'))).toContain('ACC-21');
  });

  it('on today, "previous" with no gap open goes to the last problem gone by', async () => {
    const { page, fixture, backend } = await renderDay({ plan: twoProblems(), now: at('08:50') });
    key('[');
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('tw-gap-panel h2'))).toContain('ACC-2');
  });

  it('closes the gap panel when Make the day fit is asked for: the proposal takes the side panel', async () => {
    const { page, fixture, backend } = await renderDay({ plan: twoProblems() });
    page.querySelector<HTMLButtonElement>('button.next-problem')!.click();
    await settle(fixture);
    backend.match((req) => req.url.includes('/fixes'));
    expect(page.querySelector('tw-gap-panel')).not.toBeNull();
    page.querySelector<HTMLButtonElement>('button.make-fit')!.click();
    await settle(fixture);
    expect(page.querySelector('tw-gap-panel')).toBeNull();
    expect(backend.match({ method: 'POST', url: '/api/days/2027-03-15/fit' })).toHaveLength(1);
  });

  it("explains a room's \"N to check\" and opens its first problem gap when chosen", async () => {
    const { page, fixture, backend } = await renderDay({ plan: twoProblems() });
    const toCheck = page.querySelector<HTMLButtonElement>('[data-room-id="2"] button.problems')!;
    expect(toCheck.getAttribute('aria-label')).toBe('1 to check: a gap in MR 2 snug, short or overlapping; show the first');
    toCheck.click();
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('tw-gap-panel h2'))).toContain('ACC-21');
  });

  it('after a move, lists the patients whose start changed, old → new, with copy and CSV', async () => {
    const { page, fixture, backend } = await renderDay();
    expect(page.querySelector('tw-patients-to-call')).toBeNull();
    const moved = dayPlan({ ...DAY_INPUT, exams: DAY_INPUT.exams.map((e) => (e.id === 2 ? { ...e, start: at('08:55') } : e)) });
    page.querySelector<HTMLButtonElement>('button.undo')!.click();
    backend.expectOne({ method: 'POST', url: '/api/days/2027-03-15/undo' }).flush(moved);
    await settle(fixture);
    const panel = page.querySelector('tw-patients-to-call')!;
    expect(Array.from(panel.querySelectorAll('li')).map(text)).toEqual(['ACC-2: MR 1 08:45 → 08:55']);
    const csv = decodeURIComponent(panel.querySelector<HTMLAnchorElement>('a.csv')!.getAttribute('href')!.split(',').slice(1).join(','));
    expect(csv).toContain('2027-03-15,ACC-2,MR 1,08:45,MR 1,08:55');
    panel.querySelector<HTMLButtonElement>('button.clear')!.click();
    await settle(fixture);
    expect(page.querySelector('tw-patients-to-call')).toBeNull();
  });

  it('opens the gap before the exam named in the address (?exam=, as Import links to it)', async () => {
    const { page, fixture, backend } = await renderDay({ plan: twoProblems(), exam: 'ACC-21' });
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('tw-gap-panel h2'))).toContain('ACC-21');
    expect(text(page.querySelector('.problem-steps .where'))).toBe('Problem 2 of 2');
  });
});

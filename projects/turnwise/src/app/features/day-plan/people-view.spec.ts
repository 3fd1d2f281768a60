import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { exam } from './testing/example-day';
import { ROSTER_INPUT, clashingPlan, rosterPlan } from './testing/example-roster';
import { renderDay, settle, text } from './testing/day-plan-harness';

// Invented roster day (testing/example-roster.ts): Aide 1 covers MR 1 and MR 2; nobody covers CT 1.
const viewToggle = (page: HTMLElement, name: 'Rooms' | 'People') =>
  Array.from(page.querySelectorAll<HTMLButtonElement>('.view button')).find((button) => text(button) === name)!;
const work = (page: HTMLElement, toExamId: number) => page.querySelector<HTMLButtonElement>(`[data-work-to="${toExamId}"]`)!;

async function showPeople(plan = rosterPlan()) {
  const rendered = await renderDay({ plan });
  viewToggle(rendered.page, 'People').click();
  await settle(rendered.fixture);
  return rendered;
}

describe('Day plan people view', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('offers no Rooms / People switch on a day without a roster', async () => {
    const { page } = await renderDay();
    expect(page.querySelector('tw-day-timeline')).not.toBeNull();
    expect(page.querySelector('.view')).toBeNull();
  });

  it('offers Rooms / People on a day with a roster, showing the rooms first', async () => {
    const { page } = await renderDay({ plan: rosterPlan() });
    expect(page.querySelector('.view')!.getAttribute('aria-label')).toBe('View');
    expect(viewToggle(page, 'Rooms').closest('mat-button-toggle')!.classList).toContain('mat-button-toggle-checked');
    expect(page.querySelector('tw-people-view')).toBeNull();
  });

  it('draws a lane per person, named for a screen reader, on the room timeline’s scale', async () => {
    const { page, fixture } = await renderDay({ plan: rosterPlan() });
    const roomScale = page.querySelector<HTMLElement>('tw-room-lane .track')!.style.width;
    viewToggle(page, 'People').click();
    await settle(fixture);
    expect(page.querySelector('tw-day-timeline')).toBeNull();
    const list = page.querySelector('tw-people-view [role="list"]')!;
    expect(list.getAttribute('aria-label')).toBe('People on shift');
    const lanes = Array.from(list.querySelectorAll('tw-person-lane'));
    expect(lanes.map((lane) => [lane.getAttribute('role'), lane.getAttribute('aria-label')])).toEqual([
      ['listitem', 'Aide 1, 07:00–15:00, break 11:40–12:10, 6 turnovers'],
    ]);
    expect(text(lanes[0]!.querySelector('.header'))).toContain('6 turnovers · busy');
    // Same zoom, same day: the same px per minute and the same width as the rooms' lanes.
    expect(lanes[0]!.querySelector<HTMLElement>('.track')!.style.width).toBe(roomScale);
    expect(text(page.querySelector('tw-people-view tw-time-axis .corner'))).toBe('Person');
  });

  it('places work blocks by their start, with the room and the accession, and names each', async () => {
    const { page } = await showPeople();
    const track = page.querySelector<HTMLElement>('tw-person-lane .track')!;
    const pxPerMinute = parseFloat(track.style.width) / ((12 * 60) / 1); // the day runs 07:00–19:00 (the rooms' hours)
    const at = (hhmm: string) => (Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3)) - 7 * 60) * pxPerMinute;
    expect(parseFloat(work(page, 21).style.left)).toBeCloseTo(at('09:52'), 5);
    expect(parseFloat(work(page, 2).style.left)).toBeCloseTo(at('10:15'), 5);
    expect(work(page, 2).getAttribute('aria-label')).toBe('MR 1, ACC-2, turnover 10:15–10:35, short by 6 min');
    expect(text(work(page, 2).querySelector('.room'))).toBe('MR 1');
    expect(work(page, 2).querySelector('mat-icon')!.getAttribute('data-mat-icon-name')).toBe('warning');
    expect(Array.from(page.querySelectorAll('tw-person-lane .walk')).map((walk) => walk.getAttribute('title'))).toContain('walk MR 2 → MR 1, 3 min');
    expect(page.querySelector('tw-person-lane .break')!.getAttribute('title')).toBe('break 11:40–12:10');
    expect(text(page.querySelector('tw-people-view .notes'))).toContain('Nobody on the roster covers CT 1');
  });

  it('opens the gap from its work, with the people reason and the crew in the panel', async () => {
    const { page, fixture, backend } = await showPeople();
    work(page, 2).click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [] });
    await settle(fixture);
    expect(work(page, 2).getAttribute('aria-pressed')).toBe('true');
    const panel = page.querySelector('tw-gap-panel')!;
    expect(text(panel.querySelector('h2'))).toBe('Turnover before ACC-2');
    expect(text(panel.querySelector('.people-reason'))).toBe('Short by 6 min: Aide 1 is in MR 2 until 10:12');
    expect(text(panel.querySelector('.crew'))).toBe('Aide 1');
    // Closing the panel puts the keyboard back on the work it was opened from.
    panel.querySelector<HTMLButtonElement>('button.close')!.click();
    await settle(fixture);
    expect(document.activeElement).toBe(work(page, 2));
  });

  it('steps to the next problem gap with ] and puts the keyboard on its work', async () => {
    const { page, fixture, backend } = await showPeople();
    document.dispatchEvent(new KeyboardEvent('keydown', { key: ']', bubbles: true }));
    await settle(fixture);
    backend.match(() => true);
    expect(text(page.querySelector('tw-gap-panel h2'))).toBe('Turnover before ACC-2');
    expect(document.activeElement).toBe(work(page, 2));
  });

  it('draws a clash with its hatched band, icon and word, and says it in both blocks and above the lanes', async () => {
    const { page } = await showPeople(clashingPlan());
    const clash = page.querySelector('tw-person-lane .clash')!;
    expect(text(clash.querySelector('.clash-badge'))).toBe('clash 10:25–10:35');
    expect(clash.querySelector('mat-icon')!.getAttribute('data-mat-icon-name')).toBe('warning');
    expect([work(page, 2).classList.contains('clash'), work(page, 22).classList.contains('clash'), work(page, 21).classList.contains('clash')]).toEqual([true, true, false]);
    expect(work(page, 22).getAttribute('aria-label')).toContain('clashes with MR 1, ACC-2 (10:15–10:35)');
    expect(page.querySelector('tw-person-lane')!.getAttribute('aria-label')).toContain('1 clash');
    expect(text(page.querySelector('tw-people-view .clash-note'))).toContain('1 clash: someone is booked in two places at once');
  });

  it('lists the turnovers nobody on the roster can do, each opening its gap', async () => {
    // Invented: MR 2's ACC-24 leaves at 15:20, after Aide 1's shift (07:00–15:00); ACC-25 follows at 15:45.
    const late = rosterPlan({ ...ROSTER_INPUT, exams: [...ROSTER_INPUT.exams, exam(24, 2, '14:50'), exam(25, 2, '15:45')] });
    const { page, fixture, backend } = await showPeople(late);
    const listed = Array.from(page.querySelectorAll<HTMLButtonElement>('tw-people-view .unstaffed-gap'));
    expect(listed.map(text)).toEqual(['MR 2, ACC-25 at 15:45']);
    expect(text(page.querySelector('tw-people-view .unstaffed'))).toContain('A turnover has nobody on the roster to do it');
    listed[0]!.click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=25').flush({ fixes: [] });
    await settle(fixture);
    expect(text(page.querySelector('tw-gap-panel .people-reason'))).toMatch(/^Short by \d+ min: nobody on the roster covers MR 2 then$/);
    expect(text(page.querySelector('tw-gap-panel .crew'))).toBe('nobody on the roster');
  });

  it('falls back to the rooms when the day shown has no roster', async () => {
    const { page, fixture, backend } = await showPeople();
    expect(page.querySelector('tw-people-view')).not.toBeNull();
    fixture.componentRef.setInput('date', '2027-03-16');
    await settle(fixture);
    const { people: _, ...withoutRoster } = rosterPlan();
    backend.expectOne('/api/days/2027-03-16/plan').flush({ ...withoutRoster, date: '2027-03-16' });
    await settle(fixture);
    expect(page.querySelector('tw-people-view')).toBeNull();
    expect(page.querySelector('tw-day-timeline')).not.toBeNull();
    expect(page.querySelector('.view')).toBeNull();
  });
});

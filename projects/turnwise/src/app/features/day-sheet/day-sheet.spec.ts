import { provideHttpClientTesting, HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { PlannedDay, PlanRoom } from '@shared/api/plan';
import { provideApiHttp } from '../../core/http/api-http';
import { provideIcons } from '../../core/layout/icons';
import { fakeClock } from '../../core/time/testing/fake-clock';
import { dayPlan } from '../day-plan/testing/day-plan-harness';
import { DaySheet } from './day-sheet';
import { pageRule } from './page-setup';

const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };

/** An invented CT room whose modality has no protocol: its exams, no gaps, and the plan's message. */
const NO_PROTOCOL_ROOM: PlanRoom = {
  id: 9,
  name: 'CT 9',
  modality: 'CT',
  staff: 1,
  protocol: null,
  message: 'No protocol for CT: set one up in Setup',
  closed: false,
  opensAt: '2027-03-15T07:00:00-05:00',
  closesAt: '2027-03-15T19:00:00-05:00',
  exams: [
    {
      id: 90, accession: 'ACC-90', roomId: 9, start: '2027-03-15T09:00:00-05:00', end: '2027-03-15T09:20:00-05:00', durationMinutes: 20,
      procedure: 'CT head', coil: null, precaution: 'none', mobility: 'stretcher', contrast: false, notes: null, version: 1, outsideHours: false,
    },
  ],
  gaps: [],
};

const text = (element: Element | null | undefined) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';

async function renderSheet(plan: PlannedDay) {
  TestBed.configureTestingModule({
    imports: [DaySheet],
    providers: [provideRouter([]), provideApiHttp(), provideHttpClientTesting(), provideIcons(), fakeClock('2027-03-15T14:07:30Z').provider],
  });
  const fixture = TestBed.createComponent(DaySheet);
  fixture.componentRef.setInput('date', '2027-03-15');
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  await fixture.whenStable();
  backend.expectOne('/api/days/2027-03-15/plan').flush(plan, { headers: { ETag: '"Qx7pR2mZ9w"' } });
  await fixture.whenStable();
  const page = fixture.nativeElement as HTMLElement;
  const room = (name: string) => page.querySelector<HTMLElement>(`tw-sheet-room[data-room="${name}"]`)!;
  const examRow = (accession: string) =>
    Array.from(page.querySelectorAll<HTMLElement>('tr.exam')).find((row) => row.querySelector('.accession')?.textContent === accession)!;
  return { fixture, page, room, examRow };
}

describe('DaySheet', () => {
  const plan = (): PlannedDay => {
    const day = dayPlan();
    return { ...day, rooms: [...day.rooms, NO_PROTOCOL_ROOM] };
  };

  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('heads the sheet with the site, the day, when it was printed and the plan version', async () => {
    const { page } = await renderSheet(plan());
    expect(text(page.querySelector('.site'))).toBe('Example Imaging');
    expect(text(page.querySelector('h1'))).toBe('Day sheet Monday 15 March 2027');
    // 14:07 UTC is 09:07 in Chicago on 2027-03-15 (CDT, UTC−5).
    expect(text(page.querySelector('.printed-at'))).toBe('15 Mar 2027, 09:07');
    expect(text(page.querySelector('.version'))).toBe('Qx7pR2mZ');
  });

  it('prints every room in the plan order, each under its own heading', async () => {
    const { page } = await renderSheet(plan());
    expect(Array.from(page.querySelectorAll('tw-sheet-room')).map((room) => room.getAttribute('data-room'))).toEqual(['MR 1', 'CT 1', 'MR 2', 'CT 9']);
    // The example's protocols are unstored ones (no version number to print).
    expect(text(page.querySelector('tw-sheet-room h2'))).toBe('MR 1 MR · open 07:00–19:00 · 1 person on a turnover · protocol MR');
  });

  it('gives each turnover its verdict word, the minutes it is short by and its steps by person', async () => {
    const shown = plan();
    const short = shown.rooms[0].gaps.find((gap) => gap.toExamId === 2)!;
    expect(short.verdict).toBe('short');
    expect(short.shortByMinutes).toBeGreaterThan(0);
    const { room } = await renderSheet(shown);
    const rows = Array.from(room('MR 1').querySelectorAll('tbody tr'));
    // Opening turnover, ACC-1, turnover, ACC-2, turnover, ACC-3.
    expect(rows.map((row) => row.className)).toEqual(['turnover', 'exam', 'turnover', 'exam isolation', 'turnover', 'exam']);
    const beforeAcc2 = rows[2];
    expect(beforeAcc2.getAttribute('data-verdict')).toBe('short');
    expect(text(beforeAcc2.querySelector('.verdict'))).toBe('short');
    expect(beforeAcc2.querySelector('.verdict mat-icon')!.getAttribute('data-mat-icon-name')).toBe('warning');
    expect(text(beforeAcc2.querySelector('.short-by'))).toBe(`short by ${short.shortByMinutes} min`);
    expect(text(beforeAcc2)).toContain(`needs ${short.requiredMinutes} min, has ${short.availableMinutes} min`);
    const steps = Array.from(beforeAcc2.querySelectorAll('.steps li'));
    expect(steps).toHaveLength(short.steps.length);
    expect(text(steps[0].querySelector('.person'))).toBe('Person 1');
    expect(steps.map((step) => text(step.querySelector('.name')))).toEqual(expect.arrayContaining(short.steps.map((step) => step.label)));
    // A step that leaves a surface wet says when it is dry, beside the step's name.
    const wet = short.steps.find((step) => step.dryAt !== step.end)!;
    const wetItem = steps.find((step) => text(step.querySelector('.name')) === wet.label)!;
    expect(text(wetItem.querySelector('.label'))).toMatch(new RegExp(`^${wet.label.replace(/[()]/g, '\\$&')} · dry at \\d\\d:\\d\\d$`));
    expect(text(rows[4].querySelector('.verdict'))).toBe(shown.rooms[0].gaps.find((gap) => gap.toExamId === 3)!.verdict);
  });

  it('says where each exam stands when two overlap, instead of a time running backwards', async () => {
    const day = plan();
    const acc3 = day.input.exams.find((exam) => exam.id === 3)!;
    // ACC-3 booked at 09:05, before ACC-2 (08:45, 30 min) ends.
    const overlapping = dayPlan({ ...day.input, exams: day.input.exams.map((exam) => (exam === acc3 ? { ...exam, start: '2027-03-15T09:05:00-05:00' } : exam)) });
    const gap = overlapping.rooms[0].gaps.find((candidate) => candidate.toExamId === 3)!;
    expect(gap.verdict).toBe('overlap');
    const { room } = await renderSheet(overlapping);
    const row = room('MR 1').querySelector('tr.turnover[data-verdict="overlap"]')!;
    // ACC-2 ends at 09:15.
    expect(row.querySelector('.time')!.firstChild!.textContent!.trim()).toBe('09:15');
    expect(text(row.querySelector('.next-start'))).toBe('next starts 09:05');
    expect(text(row)).toContain('exams overlap by 10 min');
    expect(text(row.querySelector('.verdict'))).toBe('overlap');
  });

  it('marks isolation cases with an icon and words, and no other exam', async () => {
    const { examRow } = await renderSheet(plan());
    const contact = examRow('ACC-2');
    expect(text(contact.querySelector('.isolation-mark'))).toBe('Isolation: contact precautions');
    expect(contact.querySelector('.isolation-mark mat-icon')!.getAttribute('data-mat-icon-name')).toBe('back_hand');
    expect(text(examRow('ACC-20').querySelector('.isolation-mark'))).toBe('Isolation: airborne precautions');
    expect(examRow('ACC-1').querySelector('.isolation-mark')).toBeNull();
    expect(examRow('ACC-1').classList).not.toContain('isolation');
    // The other marks, as words: contrast, coil and mobility.
    expect(text(contact.querySelector('tw-exam-tags'))).toBe('head coil ambulatory contrast');
  });

  it('says a room without a protocol has no turnovers, and still lists its exams', async () => {
    const { room } = await renderSheet(plan());
    expect(text(room('CT 9').querySelector('.no-protocol'))).toBe('No turnovers planned: No protocol for CT: set one up in Setup');
    expect(room('CT 9').querySelectorAll('tr.turnover')).toHaveLength(0);
    expect(text(room('CT 9').querySelector('tr.exam'))).toContain('ACC-90');
    expect(room('MR 1').querySelector('.no-protocol')).toBeNull();
  });

  it('gives MR rooms the magnet rule and the sheet the cautions', async () => {
    const { page, room } = await renderSheet(plan());
    expect(text(room('MR 1').querySelector('.magnet'))).toBe('MR room: the magnet is always on. Only MR Safe or MR Conditional items go into Zone IV.');
    expect(room('CT 1').querySelector('.magnet')).toBeNull();
    const caution = text(page.querySelector('tw-caution-note'));
    expect(caution).toContain("The disinfectant's label contact time, your facility's infection-prevention policy and local codes always rule.");
    expect(caution).toContain('Zone IV of the ACR MR safety zones');
    // ACC-20 is airborne in a 6-ACH room: the air hold's limits are said too.
    expect(caution).toContain('well-mixed air');
  });

  it("sets the page's @page rule from the paper and orientation chosen, and prints", async () => {
    const { page, fixture } = await renderSheet(plan());
    const rule = () => document.head.querySelector('style[data-tw-page]')!.textContent;
    const toggle = (name: string) => Array.from(page.querySelectorAll<HTMLButtonElement>('mat-button-toggle button')).find((button) => text(button) === name)!;
    toggle('A4').click();
    toggle('Landscape').click();
    await fixture.whenStable();
    expect(rule()).toBe(pageRule('A4', 'landscape'));
    toggle('Letter').click();
    toggle('Portrait').click();
    await fixture.whenStable();
    expect(rule()).toBe('@page { size: Letter portrait; margin: 12mm; }');

    const print = jest.spyOn(window, 'print').mockImplementation(() => undefined);
    page.querySelector<HTMLButtonElement>('button.print')!.click();
    expect(print).toHaveBeenCalledTimes(1);
    print.mockRestore();

    fixture.destroy();
    expect(document.head.querySelector('style[data-tw-page]')).toBeNull();
  });
});

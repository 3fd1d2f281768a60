import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatSnackBar } from '@angular/material/snack-bar';
import { provideRouter } from '@angular/router';
import { DateTime } from 'luxon';

import type { DayPlan as Plan } from '@shared/api/plan';
import { fakeAuth } from '../../../testing/fake-auth';
import { SessionUser } from '../../core/auth/roles';
import { errorInterceptor } from '../../core/http/error-interceptor';
import { provideIcons } from '../../core/layout/icons';
import { DayPlan } from './day-plan';
import { exampleExam, exampleGap, examplePlan, exampleRoom, exampleStep } from './testing/example-plan';

const SETTINGS = { settings: { siteName: 'Example Imaging', timezone: 'America/Chicago', snugMarginMinutes: 3 } };

// Invented day: MR 1 with opening (fits), 1→2 short by 10, 2→3 fits; the short gap has two people and steps.
const busy = examplePlan([
  exampleRoom(
    [exampleExam(1, '08:00', '08:30'), exampleExam(2, '08:40', '09:10', { precaution: 'contact', contrast: true, outsideHours: true }), exampleExam(3, '09:40', '10:10')],
    [
      exampleGap(null, 1, 'fits'),
      exampleGap(1, 2, 'short', {
        availableMinutes: 10,
        requiredMinutes: 20,
        shortByMinutes: 10,
        readyAt: '2027-03-15T08:50:00-05:00',
        staff: 2,
        steps: [
          exampleStep('clear', 'Patient out; coil, pads and linen off', '08:30', '08:33'),
          exampleStep('bore', 'Bore, from both ends', '08:33', '08:37', '08:43', 1),
        ],
      }),
      exampleGap(2, 3, 'fits', { readyAt: '2027-03-15T09:30:00-05:00' }),
    ],
    { staff: 2 },
  ),
]);

async function render(options: { date?: string; user?: SessionUser } = {}) {
  TestBed.configureTestingModule({
    imports: [DayPlan],
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([errorInterceptor])),
      provideHttpClientTesting(),
      provideIcons(),
      fakeAuth(options.user ?? { username: 'sam', role: 'scheduler' }).provider,
      { provide: MatSnackBar, useValue: { open: jest.fn() } },
    ],
  });
  const fixture = TestBed.createComponent(DayPlan);
  if (options.date) fixture.componentRef.setInput('date', options.date);
  const backend = TestBed.inject(HttpTestingController);
  backend.expectOne('/api/settings').flush(SETTINGS);
  await settle(fixture);
  return { fixture, backend, page: fixture.nativeElement as HTMLElement };
}

async function settle(fixture: ComponentFixture<DayPlan>) {
  await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

async function renderPlan(plan: Plan, user?: SessionUser) {
  const setup = await render({ date: '2027-03-15', user });
  setup.backend.expectOne('/api/days/2027-03-15/plan').flush(plan);
  await settle(setup.fixture);
  return setup;
}

const text = (element: Element | null) => element?.textContent?.replace(/\s+/g, ' ').trim() ?? '';
const gapCards = (page: HTMLElement) => Array.from(page.querySelectorAll('tw-gap-card'));

describe('DayPlan', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('shows each gap verdict as a word with an icon, not by colour alone', async () => {
    const { page } = await renderPlan(busy);
    const chips = gapCards(page).map((card) => card.querySelector('tw-verdict-chip')!);
    expect(chips.map((chip) => text(chip.querySelector('.word')))).toEqual(['fits', 'short', 'fits']);
    for (const chip of chips) expect(chip.querySelector('mat-icon')).not.toBeNull();
    expect(text(gapCards(page)[0])).toContain('Opening');
  });

  it('says how short a short gap is, and what it needs and has', async () => {
    const { page } = await renderPlan(busy);
    const short = text(gapCards(page)[1]);
    expect(short).toContain('short by 10 min');
    expect(short).toContain('needs 20 min, has 10 min');
    expect(short).toContain('ready at 08:50');
    expect(text(gapCards(page)[2])).not.toContain('short by');
  });

  it('shows the summary bar and exam times in site time, with flags in words', async () => {
    const { page } = await renderPlan(busy);
    const bar = Array.from(page.querySelectorAll('tw-verdict-summary li')).map(
      (item) => `${text(item.querySelector('.count'))} ${text(item.querySelector('.word')) || text(item).replace(/^\d+ /, '')}`,
    );
    expect(bar).toEqual(['0 overlap', '1 short', '0 snug', '2 fits', '10 min short in all']);
    const second = text(page.querySelectorAll('tw-exam-item')[1]);
    expect(second).toContain('08:40–09:10');
    expect(second).toContain('contact precautions');
    expect(second).toContain('contrast');
    expect(second).toContain('outside opening hours');
  });

  it('expands the steps with start–end, dry-at and the person doing each', async () => {
    const { page, fixture } = await renderPlan(busy);
    const card = gapCards(page)[1];
    expect(card.querySelector('.steps')).toBeNull();
    const toggle = card.querySelector<HTMLButtonElement>('button.toggle')!;
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    toggle.click();
    await settle(fixture);
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    const steps = Array.from(card.querySelectorAll('.steps li')).map(text);
    expect(steps[0]).toContain('08:30–08:33');
    expect(steps[0]).toContain('person 1');
    expect(steps[1]).toContain('08:33–08:37');
    expect(steps[1]).toContain('dry at 08:43');
    expect(steps[1]).toContain('person 2');
  });

  it('hides fitting gaps when only problem gaps are asked for', async () => {
    const { page, fixture } = await renderPlan(busy);
    expect(gapCards(page)).toHaveLength(3);
    page.querySelector<HTMLButtonElement>('mat-slide-toggle button')!.click();
    await settle(fixture);
    const verdicts = gapCards(page).map((card) => text(card.querySelector('tw-verdict-chip .word')));
    expect(verdicts).toEqual(['short']);
    expect(text(page)).toContain('1 exam with fitting gaps not shown');
  });

  it('shows an empty day with a link to Import for a role that may import', async () => {
    const { page } = await renderPlan(examplePlan([exampleRoom([], [])]));
    expect(text(page)).toContain('No exams on this day yet');
    const link = page.querySelector<HTMLAnchorElement>('a[href^="/import"]');
    expect(link?.getAttribute('href')).toBe('/import?date=2027-03-15');
  });

  it('offers no Import link to a role that may not import', async () => {
    const { page } = await renderPlan(examplePlan([exampleRoom([], [])]), { username: 'pat', role: 'tech' });
    expect(text(page)).toContain('No exams on this day yet');
    expect(page.querySelector('a[href^="/import"]')).toBeNull();
  });

  it('shows the server message in the page when the plan cannot be loaded', async () => {
    const { page, backend, fixture } = await render({ date: '2027-02-30' });
    backend
      .expectOne('/api/days/2027-02-30/plan')
      .flush({ error: { code: 'validation_failed', message: '"2027-02-30" is not a date; use YYYY-MM-DD.' } }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    expect(text(page.querySelector('[role="alert"]'))).toContain('"2027-02-30" is not a date');
  });

  it('fetches the same day again when asked to try again after a failure', async () => {
    const { page, backend, fixture } = await render({ date: '2027-03-15' });
    backend.expectOne('/api/days/2027-03-15/plan').error(new ProgressEvent('error'));
    await settle(fixture);
    expect(text(page.querySelector('[role="alert"]'))).toContain('cannot reach its server');
    page.querySelector<HTMLButtonElement>('button.retry')!.click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/plan').flush(busy);
    await settle(fixture);
    expect(gapCards(page)).toHaveLength(3);
  });

  it('without a date, shows today in the site zone', async () => {
    const { backend, page, fixture } = await render();
    const today = DateTime.now().setZone('America/Chicago').toISODate();
    backend.expectOne(`/api/days/${today}/plan`).flush(examplePlan([]));
    await settle(fixture);
    expect(page.querySelector<HTMLInputElement>('input[type="date"]')!.value).toBe(today);
  });

  it('adds the MR and air-hold cautions when the day has MR rooms and an airborne hold', async () => {
    const airborne = examplePlan([
      exampleRoom([exampleExam(1, '08:00', '08:30'), exampleExam(2, '10:00', '10:30')], [exampleGap(1, 2, 'fits', { airHoldMinutes: 70 })]),
    ]);
    const { page } = await renderPlan(airborne);
    expect(text(gapCards(page)[0])).toContain('air hold 70 min');
    const caution = text(page.querySelector('tw-caution-note'));
    expect(caution).toContain('Zone IV');
    expect(caution).toContain('well-mixed air');
  });
});

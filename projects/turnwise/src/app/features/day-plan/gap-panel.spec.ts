import { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { Fix } from '@shared/fixes/model';
import { marker, renderDay, settle, text } from './testing/day-plan-harness';

// Invented fixes for the short gap before ACC-2 (short by 10 min in the example day).
const fix = (id: string, shortByAfter: number): Fix => ({
  id,
  kind: shortByAfter ? 'add-helper' : 'push-later',
  toExamId: 2,
  title: `Fix ${id}`,
  detail: 'Invented.',
  changes: [],
  effect: {
    verdictAfter: shortByAfter ? 'short' : 'fits',
    shortByAfter,
    newProblems: 0,
    dayEndsBefore: '2027-03-15T10:15:00-05:00',
    dayEndsAfter: '2027-03-15T10:15:00-05:00',
    summaryAfter: { fits: 5, snug: 0, short: 1, overlap: 0, minutesShort: shortByAfter },
  },
});

describe('Gap panel', () => {
  afterEach(() => TestBed.inject(HttpTestingController).verify());

  it('lists fixes that make the gap fit first, and marks one that only helps', async () => {
    const { page, fixture, backend } = await renderDay();
    marker(page, 2).click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [fix('helper', 8), fix('later', 0)] });
    await settle(fixture);
    const cards = Array.from(page.querySelectorAll('tw-fix-card'));
    expect(cards.map((card) => card.getAttribute('data-fix-id'))).toEqual(['later', 'helper']);
    expect(cards.map((card) => card.classList.contains('partial'))).toEqual([false, true]);
    expect(text(cards[1].querySelector('h4'))).toBe('helps Fix helper');
    expect(text(cards[1])).toContain('helps: still short by 8 min');
    expect(text(cards[0])).not.toContain('helps');
  });

  it('says in the panel when the fixes could not be loaded', async () => {
    const { page, fixture, backend } = await renderDay();
    marker(page, 2).click();
    await settle(fixture);
    expect(page.querySelector('tw-gap-panel .fixes mat-progress-bar')).not.toBeNull();
    backend
      .expectOne('/api/days/2027-03-15/fixes?gap=2')
      .flush({ error: { code: 'busy', message: 'The server is busy. Try again in a moment.' } }, { status: 503, statusText: 'x' });
    await settle(fixture);
    expect(text(page.querySelector('tw-gap-panel .fixes [role="alert"]'))).toBe('The server is busy. Try again in a moment.');
    expect(page.querySelector('tw-gap-panel .fixes mat-progress-bar')).toBeNull();
  });

  it('says why a gap has no fix: exams that stay, or its patient already due', async () => {
    // ACC-2 starts at 08:45 in the example day (invented).
    for (const [now, words] of [
      ['2027-03-15T08:45:00-05:00', 'No fix found for this gap. Exams that have arrived, started or are pinned stay where they are.'],
      ['2027-03-15T08:46:00-05:00', 'ACC-2 was due at 08:45: this turnover is over, and no fix moves a patient already due.'],
    ]) {
      TestBed.resetTestingModule();
      const { page, fixture, backend } = await renderDay({ now });
      marker(page, 2).click();
      await settle(fixture);
      backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [] });
      await settle(fixture);
      expect(text(page.querySelector('tw-gap-panel .fixes p'))).toContain(words);
    }
  });

  it('keeps title, close, verdict and needs/has together in the header above the steps', async () => {
    const { page, fixture, backend } = await renderDay();
    marker(page, 2).click();
    await settle(fixture);
    backend.expectOne('/api/days/2027-03-15/fixes?gap=2').flush({ fixes: [] });
    await settle(fixture);
    const head = page.querySelector('tw-gap-panel header.head')!;
    expect(head.querySelector('h2')).not.toBeNull();
    expect(head.querySelector('button.close')).not.toBeNull();
    expect(head.querySelector('tw-verdict-chip')).not.toBeNull();
    expect(Array.from(head.querySelectorAll('.facts dt, .facts dd')).map(text).slice(0, 4)).toEqual(['Needs', '25 min', 'Has', '15 min']);
    expect(head.querySelector('.steps')).toBeNull();
  });

  it('names an opening as such', async () => {
    const { page, fixture } = await renderDay();
    marker(page, 1).click();
    await settle(fixture);
    expect(text(page.querySelector('tw-gap-panel h2'))).toBe('Opening before ACC-1');
    expect(text(page.querySelector('tw-gap-panel .opening-tag'))).toBe('opening');
    expect(marker(page, 1).closest('tw-gap-marker')!.classList).toContain('quiet');
  });

  it('writes the day one way only, in words, with the browser date field hidden behind it', async () => {
    const { page } = await renderDay();
    const day = page.querySelector<HTMLButtonElement>('tw-day-picker button.day')!;
    expect(text(day)).toBe('Monday 15 March 2027');
    expect(day.getAttribute('aria-label')).toBe('Day: Monday 15 March 2027. Choose another day');
    const field = page.querySelector<HTMLInputElement>('tw-day-picker input[type="date"]')!;
    expect([field.value, field.getAttribute('aria-hidden'), field.tabIndex]).toEqual(['2027-03-15', 'true', -1]);
  });
});

import { ChangeDetectionStrategy, Component, ElementRef, computed, input, output, viewChild } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import { longDay, shiftDay } from './site-time';

/**
 * Picks a `YYYY-MM-DD` day: previous / today / next, or any date from the calendar. The day is
 * written one way only, in words ("Wednesday 10 March 2027"): the browser's own date field
 * writes it in the computer's locale (03/10/2027 or 10/03/2027), so that field stays hidden and
 * only lends its calendar. It only emits; the screen decides what a new day means (a URL change
 * on the Day plan, a new preview on Import).
 */
@Component({
  selector: 'tw-day-picker',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button mat-icon-button type="button" aria-label="Previous day" (click)="picked.emit(previous())">
      <mat-icon svgIcon="chevron_left" />
    </button>
    <span class="choose">
      <button mat-stroked-button type="button" class="day" [attr.aria-label]="label() + ': ' + long() + '. Choose another day'" (click)="openCalendar()">
        <span class="long">{{ long() }}</span>
        <mat-icon iconPositionEnd svgIcon="expand_more" />
      </button>
      <input #field type="date" class="calendar" tabindex="-1" aria-hidden="true" required [value]="date()" (change)="pick($event)" />
    </span>
    <button mat-icon-button type="button" aria-label="Next day" (click)="picked.emit(next())">
      <mat-icon svgIcon="chevron_right" />
    </button>
    <button mat-stroked-button type="button" [disabled]="!today() || date() === today()" (click)="picked.emit(today()!)">
      <mat-icon svgIcon="today" />Today
    </button>
    <span class="tw-visually-hidden" aria-live="polite">{{ long() }}</span>
  `,
  styles: `
    :host { display: flex; flex-wrap: wrap; align-items: center; gap: 8px; }
    .choose { position: relative; display: inline-flex; }
    .day { --mat-button-outlined-label-text-font: var(--mat-sys-title-medium); min-width: 16em; }
    .long { font: var(--mat-sys-title-medium); }
    /* Present for its calendar (showPicker opens it under the day), never seen or tabbed to. */
    .calendar { position: absolute; left: 0; bottom: 0; width: 1px; height: 1px; padding: 0; border: 0; opacity: 0; pointer-events: none; }
  `,
})
export class DayPicker {
  readonly date = input.required<string>();
  /** Today in the site's zone; the Today button is off until it is known. */
  readonly today = input<string | null>(null);
  readonly label = input('Day');
  readonly picked = output<string>();

  private readonly field = viewChild.required<ElementRef<HTMLInputElement>>('field');

  protected readonly previous = computed(() => shiftDay(this.date(), -1));
  protected readonly next = computed(() => shiftDay(this.date(), 1));
  protected readonly long = computed(() => longDay(this.date()));

  protected openCalendar(): void {
    const field = this.field().nativeElement;
    try {
      // Every current browser has it; an older one at least gets the field focused.
      if (typeof field.showPicker === 'function') return field.showPicker();
    } catch {
      // Refused (e.g. not from a user's click): fall through.
    }
    field.focus();
  }

  protected pick(event: Event): void {
    const value = (event.target as HTMLInputElement).value;
    // A cleared or half-typed date input reports ''; keep the current day until it is whole.
    if (/^\d{4}-\d{2}-\d{2}$/.test(value)) this.picked.emit(value);
  }
}

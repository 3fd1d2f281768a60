import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import { longDay, shiftDay } from './site-time';

/**
 * Picks a `YYYY-MM-DD` day: previous / today / next, or any date. It only emits; the screen
 * decides what a new day means (a URL change on the Day plan, a new preview on Import).
 */
@Component({
  selector: 'tw-day-picker',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <button mat-icon-button type="button" aria-label="Previous day" (click)="picked.emit(previous())">
      <mat-icon svgIcon="chevron_left" />
    </button>
    <mat-form-field subscriptSizing="dynamic" class="field">
      <mat-label>{{ label() }}</mat-label>
      <input matInput type="date" required [value]="date()" (change)="pick($event)" />
    </mat-form-field>
    <button mat-icon-button type="button" aria-label="Next day" (click)="picked.emit(next())">
      <mat-icon svgIcon="chevron_right" />
    </button>
    <button mat-stroked-button type="button" [disabled]="!today() || date() === today()" (click)="picked.emit(today()!)">
      <mat-icon svgIcon="today" />Today
    </button>
    <span class="long" aria-live="polite">{{ long() }}</span>
  `,
  styles: `
    :host { display: flex; flex-wrap: wrap; align-items: center; gap: 8px; }
    .field { width: 11em; }
    .long { font: var(--mat-sys-title-medium); margin-left: 8px; }
  `,
})
export class DayPicker {
  readonly date = input.required<string>();
  /** Today in the site's zone; the Today button is off until it is known. */
  readonly today = input<string | null>(null);
  readonly label = input('Day');
  readonly picked = output<string>();

  protected readonly previous = computed(() => shiftDay(this.date(), -1));
  protected readonly next = computed(() => shiftDay(this.date(), 1));
  protected readonly long = computed(() => longDay(this.date()));

  protected pick(event: Event): void {
    const value = (event.target as HTMLInputElement).value;
    // A cleared or half-typed date input reports ''; keep the current day until it is whole.
    if (/^\d{4}-\d{2}-\d{2}$/.test(value)) this.picked.emit(value);
  }
}

import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, effect, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { DateTime } from 'luxon';

import { ICONS } from '../../core/layout/icons';
import { registerIcons } from '../../core/layout/register-icons';
import { SiteSettingsService } from '../../core/site/site-settings-service';
import { serverState } from '../../core/state/server-state';
import { Clock } from '../../core/time/clock';
import { CautionNote, cautionsForDay } from '../../shared/ui/caution-note';
import { longDay } from '../../shared/ui/site-time';
import { DaySheetService } from './day-sheet-service';
import { ORIENTATIONS, Orientation, PAPERS, Paper, pageRule, usualPaper } from './page-setup';
import { SheetRoom } from './sheet-room';

/**
 * The day sheet: the whole day on paper, room by room, for the people who turn the rooms over.
 * It lives outside the shell (no toolbar or navigation, no scrolling window), and its paper and
 * orientation set the page's `@page` rule; the choosers and buttons are left off the printout.
 */
@Component({
  selector: 'tw-day-sheet',
  imports: [MatButtonModule, MatButtonToggleModule, MatIconModule, MatProgressBarModule, RouterLink, CautionNote, SheetRoom],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './day-sheet.html',
  styleUrl: './day-sheet.scss',
})
export class DaySheet {
  private readonly document = inject(DOCUMENT);
  private readonly api = inject(DaySheetService);
  private readonly clock = inject(Clock);
  protected readonly settings = inject(SiteSettingsService).settings;

  /** `YYYY-MM-DD` from the address (`/day/2027-03-15/sheet`, bound by the router). */
  readonly date = input('');

  protected readonly sheet = serverState((date: string) => this.api.sheet(date), 'The day sheet could not be loaded.');
  protected readonly plan = computed(() => this.sheet.value()?.plan ?? null);
  protected readonly longDay = computed(() => longDay(this.date()));

  protected readonly papers = PAPERS;
  protected readonly orientations = ORIENTATIONS;
  protected readonly paper = signal<Paper>(usualPaper(this.document.defaultView?.navigator.language));
  protected readonly orientation = signal<Orientation>('portrait');

  /** When printed, to the minute, in the site's zone (the sheet is printed as it is shown). */
  protected readonly printedAt = computed(() => {
    const zone = this.plan()?.timezone ?? this.settings()?.timezone ?? 'UTC';
    return DateTime.fromMillis(this.clock.minute(), { zone, locale: 'en-GB' }).toFormat('d LLL yyyy, HH:mm');
  });

  protected readonly cautions = computed(() => cautionsForDay(this.plan()?.rooms ?? []));

  protected readonly empty = computed(() => this.plan()?.rooms.every((room) => room.exams.length === 0) ?? false);

  constructor() {
    // Outside the shell, so the sheet registers the icons it draws itself.
    registerIcons(ICONS);
    effect(() => {
      const date = this.date();
      if (date) this.sheet.show(date);
    });

    // One `@page` rule in the document's head, following the choosers; gone with the sheet.
    const rule = this.document.createElement('style');
    rule.setAttribute('data-tw-page', '');
    this.document.head.appendChild(rule);
    effect(() => (rule.textContent = pageRule(this.paper(), this.orientation())));
    inject(DestroyRef).onDestroy(() => rule.remove());
  }

  protected print(): void {
    this.document.defaultView?.print();
  }
}

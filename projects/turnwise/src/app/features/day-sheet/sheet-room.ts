import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { PlanRoom } from '@shared/api/plan';
import { ExamTags, PRECAUTION_ICONS } from '../../shared/ui/exam-tags';
import { SiteTime } from '../../shared/ui/site-time';
import { VERDICT_DISPLAY } from '../../shared/ui/verdict-chip';
import { LONG_ROOM_EXAMS, sheetRows } from './sheet-rows';

/**
 * One room on the day sheet: its exams and, before each, the turnover with its verdict and its
 * steps by person. Everything a colour says is also said in words and a border pattern, so it
 * reads on a black-and-white printout.
 */
@Component({
  selector: 'tw-sheet-room',
  imports: [MatIconModule, ExamTags, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-sheet-room', '[class.long]': 'long()', '[attr.data-room]': 'room().name' },
  templateUrl: './sheet-room.html',
  styleUrl: './sheet-room.scss',
})
export class SheetRoom {
  readonly room = input.required<PlanRoom>();

  protected readonly rows = computed(() => sheetRows(this.room()));
  protected readonly long = computed(() => this.room().exams.length > LONG_ROOM_EXAMS);
  protected readonly headingId = computed(() => `sheet-room-${this.room().id}`);
  protected readonly verdicts = VERDICT_DISPLAY;
  protected readonly precautionIcons: Readonly<Record<string, string>> = PRECAUTION_ICONS;

  protected people(staff: number): string {
    return staff === 1 ? '1 person' : `${staff} people`;
  }
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatCardModule } from '@angular/material/card';
import { MatIconModule } from '@angular/material/icon';

import type { PlanRoom } from '@shared/api/plan';
import { ExamItem } from './exam-item';
import { GapCard } from './gap-card';
import { roomSequence } from './room-sequence';

/** One room's day: its exams in order with the turnover gap before each. */
@Component({
  selector: 'tw-room-card',
  imports: [MatCardModule, MatIconModule, ExamItem, GapCard],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card appearance="outlined">
      <mat-card-header>
        <mat-card-title>
          <h2>{{ room().name }}</h2>
        </mat-card-title>
        <mat-card-subtitle>
          <span class="modality">{{ room().modality }}</span>
          <span class="staff">
            <mat-icon svgIcon="group" aria-hidden="true" />
            {{ room().staff }} {{ room().staff === 1 ? 'person' : 'people' }} on turnover
          </span>
        </mat-card-subtitle>
      </mat-card-header>
      <mat-card-content>
        @if (room().exams.length === 0) {
          <p class="quiet">No exams booked in this room.</p>
        } @else if (items().length === 0) {
          <p class="quiet">Every gap in this room fits.</p>
        } @else {
          <ol class="day">
            @for (item of items(); track $index) {
              <li>
                @switch (item.kind) {
                  @case ('exam') { <tw-exam-item [exam]="item.exam" /> }
                  @case ('gap') { <tw-gap-card [gap]="item.gap" /> }
                  @case ('hidden') {
                    <p class="hidden-note">{{ item.exams }} {{ item.exams === 1 ? 'exam' : 'exams' }} with fitting gaps not shown</p>
                  }
                }
              </li>
            }
          </ol>
        }
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    h2 { font: var(--mat-sys-title-large); margin: 0; }
    mat-card-subtitle { display: flex; flex-wrap: wrap; gap: 4px 16px; align-items: center; }
    .staff { display: inline-flex; align-items: center; gap: 4px; }
    .staff mat-icon { width: 18px; height: 18px; }
    .day { list-style: none; margin: 12px 0 0; padding: 0; display: grid; gap: 2px; }
    .quiet, .hidden-note { color: var(--mat-sys-on-surface-variant); font: var(--mat-sys-body-medium); }
    .hidden-note { margin: 4px 0 4px 24px; font-style: italic; }
  `,
})
export class RoomCard {
  readonly room = input.required<PlanRoom>();
  readonly onlyProblems = input(false);

  protected readonly items = computed(() => roomSequence(this.room(), this.onlyProblems()));
}

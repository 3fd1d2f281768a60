import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { Checklist } from '@shared/api/board';
import { PrecautionLabel } from '../../shared/ui/precaution-label';
import { SiteTime } from '../../shared/ui/site-time';

/** The two exams a turnover sits between, and the big "Exam finished" while the first is still on. */
@Component({
  selector: 'tw-turnover-exams',
  imports: [MatButtonModule, MatIconModule, PrecautionLabel, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @let c = checklist();
    <div class="pair">
      <section class="exam leaving" aria-labelledby="leaving-title">
        <h2 id="leaving-title">Leaving</h2>
        @if (c.leaving; as exam) {
          <p class="accession">{{ exam.accession }}</p>
          <p>{{ exam.procedure }}</p>
          <p>{{ exam.start | siteTime }}–{{ exam.end | siteTime }}</p>
          <tw-precaution-label [precaution]="exam.precaution" />
          @if (c.examEndedAt) {
            <p class="ended">Finished at {{ c.examEndedAt | siteTime }}</p>
          }
        } @else {
          <p>Opening: no exam before this one today.</p>
        }
      </section>
      <section class="exam arriving" aria-labelledby="arriving-title">
        <h2 id="arriving-title">Arriving</h2>
        @if (c.arriving; as exam) {
          <p class="accession">{{ exam.accession }}</p>
          <p>{{ exam.procedure }}</p>
          <p>starts {{ exam.start | siteTime }}</p>
          @if (exam.arrivedAt) {
            <p class="waiting"><mat-icon svgIcon="how_to_reg" aria-hidden="true" />Patient waiting since {{ exam.arrivedAt | siteTime }}</p>
          }
        } @else {
          <p>No exam after this one today.</p>
        }
      </section>
    </div>
    <p class="clean">
      <strong>{{ c.cleanType }} clean</strong>
      <span>· {{ c.staff }} {{ c.staff === 1 ? 'person' : 'people' }} ·</span>
      <tw-precaution-label [precaution]="c.precaution" />
    </p>
    @if (c.leaving && !c.examEndedAt) {
      <button mat-flat-button type="button" class="exam-finished" [disabled]="busy()" (click)="finished.emit(c.leaving.examId)">
        <mat-icon svgIcon="event_available" />Exam finished
      </button>
    }
  `,
  styles: `
    :host { display: flex; flex-direction: column; gap: 12px; }
    .pair { display: grid; grid-template-columns: repeat(auto-fit, minmax(260px, 1fr)); gap: 12px; }
    .exam {
      padding: 12px 16px;
      border-radius: var(--tw-radius-s);
      background: var(--mat-sys-surface-container);
      font: var(--mat-sys-body-large);
    }
    h2 { margin: 0 0 4px; font: var(--mat-sys-title-small); text-transform: uppercase; letter-spacing: 0.06em; }
    p { margin: 2px 0; }
    .accession { font: var(--mat-sys-title-large); }
    .ended, .waiting { display: flex; align-items: center; gap: 4px; font-weight: 600; }
    .clean { display: flex; flex-wrap: wrap; align-items: center; gap: 6px; margin: 0; font: var(--mat-sys-body-large); }
    .exam-finished { min-height: 72px; font-size: 1.35rem; align-self: stretch; }
    .exam-finished mat-icon { width: 28px; height: 28px; }
  `,
})
export class TurnoverExams {
  readonly checklist = input.required<Checklist>();
  readonly busy = input(false);
  /** The leaving exam's id. */
  readonly finished = output<number>();
}

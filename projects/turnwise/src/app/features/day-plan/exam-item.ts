import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { PlanExam } from '@shared/api/plan';
import { ExamTags } from '../../shared/ui/exam-tags';
import { SiteTime } from '../../shared/ui/site-time';

/** One exam slot of a room's day: time, accession, procedure and what shapes its turnover. */
@Component({
  selector: 'tw-exam-item',
  imports: [MatIconModule, ExamTags, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-exam-item' },
  template: `
    <div class="time">{{ exam().start | siteTime }}–{{ exam().end | siteTime }}</div>
    <div class="what">
      <div class="head">
        <span class="accession">{{ exam().accession }}</span>
        <span class="procedure">{{ exam().procedure }}</span>
      </div>
      <tw-exam-tags
        [coil]="exam().coil"
        [precaution]="exam().precaution"
        [mobility]="exam().mobility"
        [contrast]="exam().contrast"
      />
      @if (exam().outsideHours) {
        <div class="outside"><mat-icon svgIcon="warning" aria-hidden="true" />outside opening hours</div>
      }
      @if (exam().notes) {
        <div class="notes">{{ exam().notes }}</div>
      }
    </div>
  `,
  styles: `
    :host {
      display: grid;
      grid-template-columns: 11ch 1fr;
      gap: 12px;
      padding: 8px 10px;
      border-radius: var(--tw-radius-s);
      background: var(--mat-sys-surface-container-low);
    }
    .time { font: var(--mat-sys-title-small); font-variant-numeric: tabular-nums; }
    .head { display: flex; flex-wrap: wrap; gap: 2px 10px; margin-bottom: 2px; }
    .accession { font-weight: 600; }
    .outside { display: inline-flex; align-items: center; gap: 3px; margin-top: 2px; color: var(--tw-verdict-snug-ink); font: var(--mat-sys-label-medium); }
    .outside mat-icon { width: 16px; height: 16px; }
    .notes { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
  `,
})
export class ExamItem {
  readonly exam = input.required<PlanExam>();
}

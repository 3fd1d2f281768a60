import { ChangeDetectionStrategy, Component, computed, input, linkedSignal, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';

import type { Checklist } from '@shared/api/board';
import { NOTE_MAX_CHARS } from '@shared/api/limits';
import { PrecautionLabel } from '../../shared/ui/precaution-label';
import { SiteTime } from '../../shared/ui/site-time';

/** The two exams a turnover sits between, and the big "Exam finished" while the first is still on. */
@Component({
  selector: 'tw-turnover-exams',
  imports: [MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, PrecautionLabel, SiteTime],
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
      @if (c.examEndedAt && c.readyAt) {
        <!-- Up top as well as beside "Turnover complete" below the steps: what the next patient waits for. -->
        <span class="ready-soon">· ready at {{ c.readyAt | siteTime }}{{ lateWords() }}</span>
      }
    </p>
    @if (c.leaving && !c.examEndedAt; as leaving) {
      @if (reasonOpen()) {
        <p class="not-started" role="note">
          <mat-icon svgIcon="warning" aria-hidden="true" />
          {{ c.leaving.accession }}'s slot starts at {{ c.leaving.start | siteTime }}. Recording its end now opens the
          turnover (and any air hold) for a patient who may not have been scanned.
        </p>
        <mat-form-field class="reason" subscriptSizing="dynamic">
          <mat-label>Why record the end before the slot starts?</mat-label>
          <input matInput required [attr.maxlength]="noteMax" [value]="reason()" (input)="typeReason($event)" />
        </mat-form-field>
      }
      <button mat-flat-button type="button" class="exam-finished" [disabled]="busy() || (reasonOpen() && !reason().trim())" (click)="finish()">
        <mat-icon svgIcon="event_available" />{{ reasonOpen() ? 'Record the end early' : 'Exam finished' }}: {{ c.leaving.accession }} in {{ c.roomName }}
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
    .not-started {
      display: flex; align-items: center; gap: 6px; margin: 0; padding: 8px 12px;
      border-radius: var(--tw-radius-s); font-weight: 600;
      color: var(--tw-verdict-snug-ink); background: var(--tw-verdict-snug-tint);
    }
    .not-started mat-icon { flex: none; }
  `,
})
export class TurnoverExams {
  protected readonly noteMax = NOTE_MAX_CHARS;
  readonly checklist = input.required<Checklist>();
  readonly busy = input(false);
  /** Now on the server's clock, in ms, ticking. */
  readonly now = input.required<number>();
  /** The server refused the end as too early (its clock decides): ask for the reason. */
  readonly askReason = input(false);
  /** The leaving exam's id, and why its end is recorded before its slot starts (only then). */
  readonly finished = output<ExamFinished>();

  /** The reason belongs to one leaving exam: the next one starts with an empty form. */
  private readonly leavingId = computed(() => this.checklist().leaving?.examId ?? null);
  protected readonly reason = linkedSignal({ source: this.leavingId, computation: () => '' });
  private readonly opened = linkedSignal({ source: this.leavingId, computation: () => false });
  private readonly notStarted = computed(() => {
    const leaving = this.checklist().leaving;
    return !!leaving && Date.parse(leaving.start) > this.now();
  });
  protected readonly reasonOpen = computed(() => this.opened() || this.askReason());
  /** ", 6 min after ACC-1012's start" when the room will be ready after the arriving patient's slot begins. */
  protected readonly lateWords = computed(() => {
    const { readyAt, arriving } = this.checklist();
    if (!readyAt || !arriving) return '';
    const late = Math.ceil((Date.parse(readyAt) - Date.parse(arriving.start)) / 60_000);
    return late > 0 ? `, ${late} min after ${arriving.accession}'s start` : '';
  });

  protected typeReason(event: Event): void {
    this.reason.set((event.target as HTMLInputElement).value);
  }

  protected finish(): void {
    const leaving = this.checklist().leaving;
    if (!leaving) return;
    if (!this.reasonOpen()) {
      if (this.notStarted()) this.opened.set(true);
      else this.finished.emit({ examId: leaving.examId });
      return;
    }
    const reason = this.reason().trim();
    if (reason) this.finished.emit({ examId: leaving.examId, earlyReason: reason });
  }
}

/** What "Exam finished" sends. */
export interface ExamFinished {
  examId: number;
  earlyReason?: string;
}

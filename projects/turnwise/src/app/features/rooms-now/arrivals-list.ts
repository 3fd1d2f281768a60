import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { BoardArrival } from '@shared/api/board';
import { SiteTime } from '../../shared/ui/site-time';

/**
 * The front desk's arrivals for the coming hour across every room, by start: each patient can
 * be marked arrived from here, not only the next one per room.
 */
@Component({
  selector: 'tw-arrivals-list',
  imports: [MatButtonModule, MatIconModule, SiteTime],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2 id="arrivals-title">Arrivals in the coming hour</h2>
    @if (arrivals().length === 0) {
      <p class="none">No patient is due in the coming hour.</p>
    } @else {
      <ol class="list" aria-labelledby="arrivals-title">
        @for (arrival of arrivals(); track arrival.examId) {
          <li [attr.data-exam]="arrival.examId">
            <strong class="time">{{ arrival.start | siteTime }}</strong>
            <span class="room">{{ arrival.roomName }}</span>
            <span class="accession" [title]="arrival.accession">{{ arrival.accession }}</span>
            <span class="procedure">{{ arrival.procedure }}</span>
            <span class="status">
              @if (arrival.arrivedAt) {
                <span class="waiting"><mat-icon svgIcon="how_to_reg" aria-hidden="true" />Waiting since {{ arrival.arrivedAt | siteTime }}</span>
                @if (canMark()) {
                  <button mat-button type="button" class="undo-arrived" [disabled]="busy()"
                    [attr.aria-label]="'Undo arrival of ' + arrival.accession" (click)="undoArrived.emit(arrival.examId)">
                    <mat-icon svgIcon="undo" />Undo
                  </button>
                }
              } @else if (canMark()) {
                <button mat-stroked-button type="button" class="mark-arrived" [disabled]="busy()"
                  [attr.aria-label]="'Mark arrived: ' + arrival.accession + ', ' + arrival.roomName" (click)="arrived.emit(arrival.examId)">
                  <mat-icon svgIcon="how_to_reg" />Mark arrived
                </button>
              } @else {
                <span class="expected">Expected</span>
              }
            </span>
          </li>
        }
      </ol>
    }
  `,
  styles: `
    :host { display: block; padding: 12px 16px; border-radius: var(--tw-radius-l); background: var(--mat-sys-surface-container-low); border: 1px solid var(--mat-sys-outline-variant); }
    h2 { margin: 0 0 8px; font: var(--mat-sys-title-large); }
    .none { margin: 0; }
    .list { display: grid; margin: 0; padding: 0; list-style: none; }
    li {
      display: grid;
      grid-template-columns: 4em 5em 10em minmax(8em, 1fr) auto;
      align-items: center;
      gap: 4px 12px;
      min-height: 52px;
      border-top: 1px solid var(--mat-sys-outline-variant);
    }
    li:first-child { border-top: 0; }
    .time { font: var(--mat-sys-title-medium); font-variant-numeric: tabular-nums; }
    /* One line: an accession broken in two reads as two numbers (a long one ends in "…", whole on hover). */
    .accession { white-space: nowrap; overflow: hidden; text-overflow: ellipsis; font-variant-numeric: tabular-nums; }
    .status { display: flex; flex-wrap: wrap; align-items: center; justify-content: flex-end; gap: 4px 8px; }
    .waiting { display: inline-flex; align-items: center; gap: 4px; font-weight: 600; color: var(--tw-state-in-exam-ink); }
    button { min-height: 48px; }
    mat-icon { width: 20px; height: 20px; flex: none; }
    @media (max-width: 700px) {
      li { grid-template-columns: 4em 1fr auto; padding: 6px 0; }
      .procedure { grid-column: 2 / 3; }
      .status { grid-column: 1 / -1; justify-content: flex-start; }
    }
  `,
})
export class ArrivalsList {
  readonly arrivals = input.required<readonly BoardArrival[]>();
  readonly canMark = input(false);
  /** An arrival call is on its way: the buttons wait for its answer. */
  readonly busy = input(false);

  readonly arrived = output<number>();
  readonly undoArrived = output<number>();
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { RouterLink } from '@angular/router';

import { SiteTime } from '../../shared/ui/site-time';
import { VerdictChip } from '../../shared/ui/verdict-chip';
import type { ImportProblem } from './import-problems';

/**
 * Where the list's problem gaps are: by room, each with its time, the exam after it and its
 * verdict. Once imported, each leads to that gap on the Day plan.
 */
@Component({
  selector: 'tw-problem-gap-list',
  imports: [RouterLink, SiteTime, VerdictChip],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { class: 'tw-problem-gap-list' },
  template: `
    <h3>Problem gaps ({{ problems().length }})</h3>
    @if (!linked()) {
      <p class="hint">Each opens on the Day plan once the list is imported.</p>
    }
    @for (room of byRoom(); track room.name) {
      <section [attr.aria-label]="room.name">
        <h4>{{ room.name }}</h4>
        <ul>
          @for (problem of room.problems; track problem.accession) {
            <li>
              @if (linked()) {
                <a [routerLink]="['/day', date()]" [queryParams]="{ exam: problem.accession }">
                  {{ problem.start | siteTime }} before {{ problem.accession }}
                </a>
              } @else {
                <span>{{ problem.start | siteTime }} before {{ problem.accession }}</span>
              }
              <tw-verdict-chip [verdict]="problem.verdict" />
              @if (problem.shortByMinutes > 0) {
                <span class="short-by">short by {{ problem.shortByMinutes }} min</span>
              }
            </li>
          }
        </ul>
      </section>
    }
  `,
  styles: `
    :host { display: grid; gap: 6px; }
    h3 { margin: 0; font: var(--mat-sys-title-small); }
    h4 { margin: 0; font: var(--mat-sys-label-large); }
    .hint { margin: 0; font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    :host { grid-template-columns: repeat(auto-fill, minmax(16rem, 1fr)); }
    h3, .hint { grid-column: 1 / -1; }
    ul { margin: 0; padding: 0; list-style: none; display: grid; gap: 2px; }
    li { display: flex; flex-wrap: wrap; align-items: center; gap: 4px 8px; min-height: 28px; font-variant-numeric: tabular-nums; }
    .short-by { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
  `,
})
export class ProblemGapList {
  readonly problems = input.required<readonly ImportProblem[]>();
  readonly date = input.required<string>();
  /** True once imported: the gaps are on the Day plan to open. */
  readonly linked = input(false);

  protected readonly byRoom = computed(() => {
    const rooms = new Map<string, ImportProblem[]>();
    for (const problem of this.problems()) rooms.set(problem.room, [...(rooms.get(problem.room) ?? []), problem]);
    return [...rooms].map(([name, problems]) => ({ name, problems }));
  });
}

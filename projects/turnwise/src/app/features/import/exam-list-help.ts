import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatCardModule } from '@angular/material/card';

import { EXAM_LIST_COLUMNS } from '@shared/exam-list/columns';

/** The file's columns, from the same definitions the server reads files by. */
@Component({
  selector: 'tw-exam-list-help',
  imports: [MatCardModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-card appearance="outlined">
      <mat-card-header><mat-card-title><h2>The day list file</h2></mat-card-title></mat-card-header>
      <mat-card-content>
        <p>
          CSV (UTF-8, comma, header row) or the first sheet of an Excel .xlsx file. Column names are
          matched without regard to case, in any order.
        </p>
        <dl>
          @for (column of columns; track column.name) {
            <div>
              <dt><code>{{ column.name }}</code>&ngsp;<span class="need">{{ column.required ? 'required' : 'optional' }}</span></dt>
              <dd>{{ column.description }}</dd>
            </div>
          }
        </dl>
        <p class="privacy">
          No patient names or dates of birth are needed, and Turnwise stores none: the accession links
          each exam back to your own systems. Leave such columns out of the file.
        </p>
      </mat-card-content>
    </mat-card>
  `,
  styles: `
    h2 { font: var(--mat-sys-title-medium); margin: 0; }
    dl { margin: 8px 0; display: grid; gap: 6px; }
    dt { font-weight: 500; }
    dd { margin: 0 0 0 12px; font: var(--mat-sys-body-small); }
    .need { font: var(--mat-sys-label-small); color: var(--mat-sys-on-surface-variant); margin-left: 4px; }
    .privacy { font: var(--mat-sys-body-small); }
  `,
})
export class ExamListHelp {
  protected readonly columns = EXAM_LIST_COLUMNS;
}

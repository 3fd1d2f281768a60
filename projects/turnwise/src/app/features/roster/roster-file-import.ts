import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

import type { ApiError, Problem } from '@shared/api/errors';
import { ROSTER_ROLE_LABEL, type RosterRow } from '@shared/api/roster';
import { RosterApi } from './roster-api';

type Step =
  | { step: 'choose' }
  | { step: 'checking' }
  | { step: 'preview'; file: File; rows: RosterRow[] }
  | { step: 'refused'; problems: Problem[]; message: string }
  | { step: 'imported'; people: number };

/**
 * The Import screen's optional second file: the day's roster (CSV or .xlsx, columns in the
 * README). Checked first (nothing saved), then imported as the day's roster; a refused file lists
 * every problem by row and column, as the exam list's refusal does.
 */
@Component({
  selector: 'tw-roster-file-import',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="roster-file" aria-labelledby="roster-file-heading">
      <h2 id="roster-file-heading">Roster file (optional)</h2>
      <p class="hint">Who is on shift on {{ date() }}: columns name, role, count, start, end, breaks, rooms. It replaces the day's roster.</p>
      <input #picker type="file" accept=".csv,.xlsx,text/csv" hidden (change)="check(picker)" />
      @switch (state().step) {
        @case ('preview') {
          @if (preview(); as shown) {
            <p>{{ shown.people }} on shift: {{ shown.rows }}</p>
            <div class="actions">
              <button mat-flat-button type="button" class="import-roster" (click)="commit()">Import the roster</button>
              <button mat-button type="button" (click)="state.set({ step: 'choose' })">Cancel</button>
            </div>
          }
        }
        @case ('imported') {
          <p role="status"><mat-icon svgIcon="check_circle" aria-hidden="true" /> Roster imported: {{ imported() }} on shift. The day plan is staffed from it.</p>
        }
        @default {
          <button mat-stroked-button type="button" class="choose-roster" [disabled]="state().step === 'checking'" (click)="picker.click()">
            <mat-icon svgIcon="upload_file" />Choose a roster file
          </button>
        }
      }
      @if (refusal(); as refused) {
        <div class="refused" role="alert">
          <p><strong>{{ refused.message }}</strong></p>
          <ul>
            @for (p of refused.problems; track $index) {
              <li>{{ p.field }}: {{ p.message }}</li>
            }
          </ul>
        </div>
      }
    </section>
  `,
  styles: `
    .roster-file { margin-top: 24px; }
    h2 { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .hint { color: var(--mat-sys-on-surface-variant); margin: 0 0 8px; }
    .actions { display: flex; gap: 8px; }
    .refused { color: var(--mat-sys-error); }
    mat-icon { vertical-align: middle; }
  `,
})
export class RosterFileImport {
  readonly date = input.required<string>();
  private readonly api = inject(RosterApi);
  protected readonly state = signal<Step>({ step: 'choose' });
  protected readonly preview = computed(() => {
    const state = this.state();
    if (state.step !== 'preview') return null;
    const count = state.rows.reduce((sum, row) => sum + row.count, 0);
    const rows = state.rows.map((row) => row.name ?? `${row.count} × ${ROSTER_ROLE_LABEL[row.role].toLowerCase()}`).join(', ');
    return { people: `${count} ${count === 1 ? 'person' : 'people'}`, rows };
  });
  protected readonly refusal = computed(() => {
    const state = this.state();
    return state.step === 'refused' ? state : null;
  });
  protected readonly imported = computed(() => {
    const state = this.state();
    return state.step === 'imported' ? `${state.people} ${state.people === 1 ? 'person' : 'people'}` : '';
  });

  protected check(picker: HTMLInputElement): void {
    const file = picker.files?.[0];
    picker.value = '';
    if (!file) return;
    this.state.set({ step: 'checking' });
    this.api.previewFile(this.date(), file).subscribe({
      next: (rows) => this.state.set({ step: 'preview', file, rows }),
      error: (error: ApiError) => this.refused(error),
    });
  }

  protected commit(): void {
    const state = this.state();
    if (state.step !== 'preview') return;
    this.state.set({ step: 'checking' });
    this.api.importFile(this.date(), state.file).subscribe({
      next: (roster) => this.state.set({ step: 'imported', people: roster.people.length }),
      error: (error: ApiError) => this.refused(error),
    });
  }

  private refused(error: ApiError): void {
    const problems = (error.details as { problems?: Problem[] } | undefined)?.problems ?? [];
    this.state.set({ step: 'refused', problems: error.code === 'validation_failed' ? problems : [], message: error.message });
  }
}

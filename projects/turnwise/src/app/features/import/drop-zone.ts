import { ChangeDetectionStrategy, Component, input, output, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/** Where the exam-list file comes in: dropped on the zone or chosen with the button. */
@Component({
  selector: 'tw-drop-zone',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: {
    class: 'tw-drop-zone',
    '[class.over]': 'over()',
    '(dragenter)': 'hold($event)',
    '(dragover)': 'hold($event)',
    '(dragleave)': 'over.set(false)',
    '(drop)': 'drop($event)',
  },
  template: `
    <mat-icon svgIcon="cloud_upload" aria-hidden="true" />
    <p>Drop the day list here (CSV or Excel .xlsx, up to 5 MB), or</p>
    <button mat-flat-button type="button" [disabled]="disabled()" (click)="picker.click()">
      <mat-icon svgIcon="upload_file" />Choose file
    </button>
    <input #picker type="file" accept=".csv,.xlsx" hidden (change)="pick(picker)" />
  `,
  styles: `
    :host {
      display: grid;
      justify-items: center;
      gap: 8px;
      padding: 24px 16px;
      border: 2px dashed var(--mat-sys-outline);
      border-radius: var(--tw-radius-l);
      text-align: center;
    }
    :host(.over) { border-color: var(--mat-sys-primary); background: var(--mat-sys-primary-container); }
    mat-icon[svgIcon='cloud_upload'] { width: 40px; height: 40px; color: var(--mat-sys-primary); }
    p { margin: 0; }
  `,
})
export class DropZone {
  readonly disabled = input(false);
  readonly chosen = output<File>();

  protected readonly over = signal(false);

  protected hold(event: DragEvent): void {
    // Without preventDefault the browser opens a dropped file instead of handing it to us.
    event.preventDefault();
    if (!this.disabled()) this.over.set(true);
  }

  protected drop(event: DragEvent): void {
    event.preventDefault();
    this.over.set(false);
    const file = event.dataTransfer?.files[0];
    if (file && !this.disabled()) this.chosen.emit(file);
  }

  protected pick(picker: HTMLInputElement): void {
    const file = picker.files?.[0];
    // Cleared so choosing the same file again (after fixing it) fires change again.
    picker.value = '';
    if (file) this.chosen.emit(file);
  }
}

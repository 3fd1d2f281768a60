import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_FORM_FIELD_DEFAULT_OPTIONS, MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import { ROSTER_LIMITS, ROSTER_ROLE_LABEL, ROSTER_ROLES } from '@shared/api/roster';
import { fieldMessage } from '../setup/form-problems';
import { breakGroup, rowGroup, type RosterForm, type RowGroup } from './roster-form';

/**
 * The roster's rows as fields: per row a name (empty for a count of anonymous people), role, how
 * many, shift start and end, breaks and the rooms covered. Used by the Day plan's roster dialog
 * and Setup's weekly default; the server's 422 problems show under their fields.
 */
@Component({
  selector: 'tw-roster-rows',
  imports: [ReactiveFormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  providers: [{ provide: MAT_FORM_FIELD_DEFAULT_OPTIONS, useValue: { subscriptSizing: 'dynamic' } }],
  template: `
    @let rows = form().controls.rows;
    @if (rows.length === 0) {
      <p class="none">Nobody on the roster: each room's turnovers are planned with the room's own staff.</p>
    }
    <ol class="rows" [formGroup]="form()">
      @for (row of rows.controls; track row; let i = $index) {
        <li class="row" [formGroup]="row">
          <fieldset>
            <legend>{{ title(row, i) }}</legend>
            <mat-form-field class="name">
              <mat-label>Name</mat-label>
              <input matInput formControlName="name" [maxlength]="limits.nameChars" />
              <mat-hint>Empty: a count of people</mat-hint>
              <mat-error>{{ message(row, 'name') }}</mat-error>
            </mat-form-field>
            <mat-form-field class="role">
              <mat-label>Role</mat-label>
              <mat-select formControlName="role">
                @for (role of roles; track role) {
                  <mat-option [value]="role">{{ roleLabel[role] }}</mat-option>
                }
              </mat-select>
            </mat-form-field>
            @if (row.controls.name.value.trim() === '') {
              <mat-form-field class="count">
                <mat-label>How many</mat-label>
                <input matInput type="number" formControlName="count" min="1" [max]="limits.count" step="1" />
                <mat-error>{{ message(row, 'count') }}</mat-error>
              </mat-form-field>
            }
            <mat-form-field class="time">
              <mat-label>Start</mat-label>
              <input matInput type="time" formControlName="start" />
              <mat-error>{{ message(row, 'start') }}</mat-error>
            </mat-form-field>
            <mat-form-field class="time">
              <mat-label>End</mat-label>
              <input matInput type="time" formControlName="end" />
              <mat-error>{{ message(row, 'end') }}</mat-error>
            </mat-form-field>
            <mat-form-field class="rooms">
              <mat-label>Rooms covered</mat-label>
              <mat-select formControlName="roomIds" multiple>
                @for (room of rooms(); track room.id) {
                  <mat-option [value]="room.id">{{ room.name }}</mat-option>
                }
              </mat-select>
              <mat-error>{{ message(row, 'roomIds') }}</mat-error>
            </mat-form-field>
            <div class="breaks" formArrayName="breaks">
              @for (pause of row.controls.breaks.controls; track pause; let b = $index) {
                <div class="break" [formGroupName]="b" role="group" [attr.aria-label]="'Break ' + (b + 1)">
                  <mat-form-field class="time">
                    <mat-label>Break from</mat-label>
                    <input matInput type="time" formControlName="start" />
                    <mat-error>{{ message(pause, 'start') }}</mat-error>
                  </mat-form-field>
                  <mat-form-field class="time">
                    <mat-label>to</mat-label>
                    <input matInput type="time" formControlName="end" />
                    <mat-error>{{ message(pause, 'end') }}</mat-error>
                  </mat-form-field>
                  @if (!readOnly()) {
                    <button mat-icon-button type="button" class="remove-break" [attr.aria-label]="'Remove break ' + (b + 1) + ' of ' + title(row, i)" (click)="row.controls.breaks.removeAt(b)">
                      <mat-icon svgIcon="close" />
                    </button>
                  }
                </div>
              }
              @if (!readOnly() && row.controls.breaks.length < limits.breaks) {
                <button mat-button type="button" class="add-break" (click)="row.controls.breaks.push(newBreak())"><mat-icon svgIcon="add_circle" />Break</button>
              }
              @if (!readOnly()) {
                <button mat-button type="button" class="remove-row" [attr.aria-label]="'Remove ' + title(row, i)" (click)="rows.removeAt(i)">
                  <mat-icon svgIcon="remove_circle" />Remove
                </button>
              }
            </div>
          </fieldset>
        </li>
      }
    </ol>
    @if (!readOnly() && rows.length < limits.rows) {
      <div class="add">
        <button mat-stroked-button type="button" class="add-person" (click)="add(false)"><mat-icon svgIcon="add_circle" />Person</button>
        <button mat-stroked-button type="button" class="add-count" (click)="add(true)"><mat-icon svgIcon="add_circle" />Count of aides</button>
      </div>
    }
  `,
  styles: `
    :host { display: block; }
    .none { color: var(--mat-sys-on-surface-variant); }
    .rows { list-style: none; margin: 0; padding: 0; display: flex; flex-direction: column; gap: 8px; }
    fieldset { display: flex; flex-wrap: wrap; gap: 4px 12px; align-items: flex-start; border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; padding: 8px 12px; margin: 0; }
    legend { padding: 0 4px; font: var(--mat-sys-title-small); }
    .name { flex: 1 1 12rem; }
    .role { flex: 0 1 10rem; }
    .count { flex: 0 0 7rem; }
    .time { flex: 0 0 8rem; }
    .rooms { flex: 1 1 12rem; }
    .breaks { display: flex; flex-wrap: wrap; gap: 4px 12px; align-items: center; flex: 1 1 100%; }
    .break { display: flex; gap: 8px; align-items: flex-start; }
    .remove-row { margin-left: auto; }
    .add { display: flex; gap: 8px; margin-top: 8px; }
  `,
})
export class RosterRows {
  readonly form = input.required<RosterForm>();
  readonly rooms = input.required<readonly { id: number; name: string }[]>();
  readonly readOnly = input(false);

  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly roles = ROSTER_ROLES;
  protected readonly roleLabel = ROSTER_ROLE_LABEL;
  protected readonly limits = ROSTER_LIMITS;

  protected title(row: RowGroup, i: number): string {
    const { name, role, count } = row.getRawValue();
    if (name.trim() !== '') return name.trim();
    const label = ROSTER_ROLE_LABEL[role];
    return `Row ${i + 1}: ${count} × ${label.toLowerCase()}`;
  }

  protected message(group: { get(path: string): unknown }, field: string): string {
    return fieldMessage(group.get(field) as Parameters<typeof fieldMessage>[0]);
  }

  protected newBreak() {
    return breakGroup(this.fb);
  }

  /** A person (a name to type) or a count of aides covering the same rooms as the row above. */
  protected add(count: boolean): void {
    const rows = this.form().controls.rows;
    const above = rows.at(rows.length - 1)?.getRawValue();
    const row = rowGroup(this.fb, {
      role: count ? 'aide' : 'technologist',
      count: count ? 2 : 1,
      start: above?.start,
      end: above?.end,
      roomIds: above?.roomIds,
    });
    rows.push(row);
  }
}

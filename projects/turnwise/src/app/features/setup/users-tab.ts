import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';

import type { UserAccount } from '@shared/api/users';
import { AuthService } from '../../core/auth/auth-service';
import { roleLabel } from '../../core/auth/roles';
import { serverState } from '../../core/state/server-state';
import { ConfirmDialog, type ConfirmData } from './confirm-dialog';
import { ResetPasswordDialog } from './reset-password-dialog';
import { SetupApi } from './setup-api';
import { tableView } from './table-view';
import { UserDialog } from './user-dialog';

/** Setup → Users: accounts with role and e-mail; reset a password, deactivate, reactivate. */
@Component({
  selector: 'tw-users-tab',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatPaginatorModule, MatSortModule, MatTableModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <div class="bar">
      <mat-form-field class="filter" subscriptSizing="dynamic">
        <mat-label>Filter users</mat-label>
        <input matInput (input)="view.setFilter($any($event.target).value)" />
      </mat-form-field>
      <button mat-flat-button type="button" (click)="edit(null)">Add a user</button>
    </div>
    @if (message(); as text) {
      <p class="load-error" role="alert">{{ text }}</p>
    }
    @if (users.status() === 'failed') {
      <p class="load-error" role="alert">{{ users.error()?.message }}</p>
    }
    <div class="table-wrap">
      <table mat-table [dataSource]="view.visible()" matSort (matSortChange)="view.setSort($event)" aria-label="Users">
        <ng-container matColumnDef="username">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Username</th>
          <td mat-cell *matCellDef="let user" [class.retired]="!user.active">{{ user.username }}</td>
        </ng-container>
        <ng-container matColumnDef="displayName">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Name and e-mail</th>
          <td mat-cell *matCellDef="let user">
            {{ user.displayName }}
            <div class="muted">{{ user.email ?? 'no e-mail' }}</div>
          </td>
        </ng-container>
        <ng-container matColumnDef="role">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Role</th>
          <td mat-cell *matCellDef="let user">{{ roleLabel(user.role) }}</td>
        </ng-container>
        <ng-container matColumnDef="status">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Status</th>
          <td mat-cell *matCellDef="let user">
            <span class="badge">{{ !user.active ? 'deactivated' : user.mustChangePassword ? 'must change password' : 'active' }}</span>
          </td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let user" class="actions">
            @if (user.active) {
              <button mat-button type="button" (click)="edit(user)" [attr.aria-label]="'Edit ' + user.username">Edit</button>
              <button mat-button type="button" (click)="reset(user)" [attr.aria-label]="'Reset password of ' + user.username">Reset password</button>
              @if (user.username !== me()) {
                <button mat-button type="button" (click)="deactivate(user)" [attr.aria-label]="'Deactivate ' + user.username">Deactivate</button>
              }
            } @else {
              <button mat-button type="button" (click)="reactivate(user)" [attr.aria-label]="'Reactivate ' + user.username">Reactivate</button>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ users.status() === 'loading' ? 'Loading users…' : 'No users match.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [length]="view.matching().length" [pageIndex]="view.pageIndex()" [pageSize]="view.pageSize()" [pageSizeOptions]="[10, 25, 50]" (page)="view.setPage($event)" aria-label="User pages" />
  `,
  styleUrl: './setup-table.scss',
})
export class UsersTab {
  private readonly api = inject(SetupApi);
  private readonly dialog = inject(MatDialog);
  private readonly auth = inject(AuthService);
  protected readonly me = computed(() => this.auth.user()?.username);
  protected readonly columns = ['username', 'displayName', 'role', 'status', 'actions'];
  protected readonly roleLabel = roleLabel;
  protected readonly users = serverState(() => this.api.users(), 'The users could not be shown.');
  protected readonly message = signal<string | null>(null);
  protected readonly view = tableView(
    computed(() => this.users.value() ?? []),
    (user) => `${user.username} ${user.displayName} ${user.email ?? ''} ${roleLabel(user.role)}`,
    (user, column) => (column === 'status' ? String(user.active) : column === 'role' ? roleLabel(user.role) : (user[column as 'username' | 'displayName'] ?? '')),
  );

  constructor() {
    this.users.show('all');
  }

  protected async edit(user: UserAccount | null): Promise<void> {
    const saved = await firstValueFrom(this.dialog.open(UserDialog, { data: user }).afterClosed());
    if (saved) this.users.reload();
  }

  protected async reset(user: UserAccount): Promise<void> {
    const saved = await firstValueFrom(this.dialog.open(ResetPasswordDialog, { data: user }).afterClosed());
    if (saved) this.users.reload();
  }

  protected async deactivate(user: UserAccount): Promise<void> {
    const data: ConfirmData = {
      title: `Deactivate ${user.displayName || user.username}?`,
      text: 'They are signed out everywhere at once and can no longer sign in. Their name stays on what they recorded. You can reactivate them later.',
      confirm: 'Deactivate',
    };
    if (!(await firstValueFrom(this.dialog.open(ConfirmDialog, { data }).afterClosed()))) return;
    await this.setActive(user, false);
  }

  protected reactivate(user: UserAccount): Promise<void> {
    return this.setActive(user, true);
  }

  private async setActive(user: UserAccount, active: boolean): Promise<void> {
    this.message.set(null);
    try {
      await firstValueFrom(this.api.setActive(user.id, active));
      this.users.reload();
    } catch (error) {
      // 409 last_admin says to make another admin first
      this.message.set((error as { message?: string }).message ?? 'That could not be done.');
    }
  }
}

import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom } from 'rxjs';

import { hasErrorCode } from '@shared/api/errors';
import { PRODUCT_KIND_LABELS, type ProductAnswer, type ProductView } from '@shared/api/protocols';
import { action } from '../../core/state/action';
import { serverState } from '../../core/state/server-state';
import { CautionNote } from '../../shared/ui/caution-note';
import { ConfirmDialog, type ConfirmData } from './confirm-dialog';
import { ProductDialog } from './product-dialog';
import { ProtocolsApi } from './protocols-api';
import { tableView } from './table-view';

/** Setup → Products: the site's disinfectants with their label contact times; add, edit, retire. */
@Component({
  selector: 'tw-products-tab',
  imports: [MatButtonModule, MatFormFieldModule, MatInputModule, MatPaginatorModule, MatSortModule, MatTableModule, CautionNote],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <tw-caution-note />
    <div class="bar">
      <mat-form-field class="filter" subscriptSizing="dynamic">
        <mat-label>Filter products</mat-label>
        <input matInput (input)="view.setFilter($any($event.target).value)" />
      </mat-form-field>
      <button mat-flat-button type="button" (click)="edit(null)">Add a product</button>
    </div>
    @if (message(); as text) {
      <p class="load-error" role="alert">{{ text }}</p>
    }
    @for (warning of warnings(); track $index) {
      <p class="notice" role="status">{{ warning }}</p>
    }
    @if (products.status() === 'failed') {
      <p class="load-error" role="alert">{{ products.error()?.message }}</p>
    }
    <div class="table-wrap">
      <table mat-table [dataSource]="view.visible()" matSort (matSortChange)="view.setSort($event)" aria-label="Products">
        <ng-container matColumnDef="name">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Product</th>
          <td mat-cell *matCellDef="let product" [class.retired]="product.retired">
            {{ product.name }}{{ product.retired ? ' (retired)' : '' }}
            @if (product.registration) {
              <div class="muted">Reg. {{ product.registration }}</div>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="kind">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Kind</th>
          <td mat-cell *matCellDef="let product">{{ kindLabel(product) }}</td>
        </ng-container>
        <ng-container matColumnDef="contactMinutes">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Contact</th>
          <td mat-cell *matCellDef="let product">{{ product.contactMinutes }} min</td>
        </ng-container>
        <ng-container matColumnDef="staysWetMinutes">
          <th mat-header-cell *matHeaderCellDef mat-sort-header>Stays wet</th>
          <td mat-cell *matCellDef="let product">
            {{ product.staysWetMinutes === null ? '—' : product.staysWetMinutes + ' min' }}
            @if (product.applications > 1) {
              <div class="muted">wetted {{ product.applications }}×</div>
            }
          </td>
        </ng-container>
        <ng-container matColumnDef="usedBy">
          <th mat-header-cell *matHeaderCellDef>Used by</th>
          <td mat-cell *matCellDef="let product">{{ product.usedBy.join(', ') || '—' }}</td>
        </ng-container>
        <ng-container matColumnDef="actions">
          <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Actions</span></th>
          <td mat-cell *matCellDef="let product" class="actions">
            @if (!product.retired) {
              <button mat-button type="button" (click)="edit(product)" [attr.aria-label]="'Edit ' + product.name">Edit</button>
              <button mat-button type="button" (click)="retire(product)" [disabled]="retiring.pending()" [attr.aria-label]="'Retire ' + product.name">Retire</button>
            }
          </td>
        </ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
        <tr class="mat-mdc-row" *matNoDataRow>
          <td class="mat-mdc-cell empty" [attr.colspan]="columns.length">{{ products.status() === 'loading' ? 'Loading products…' : 'No products yet, or none matches.' }}</td>
        </tr>
      </table>
    </div>
    <mat-paginator [length]="view.matching().length" [pageIndex]="view.pageIndex()" [pageSize]="view.pageSize()" [pageSizeOptions]="[10, 25, 50]" (page)="view.setPage($event)" aria-label="Product pages" />
    <p class="muted">A retired product can no longer be chosen in a protocol; past turnovers and the cleaning log keep it.</p>
  `,
  styleUrl: './setup-table.scss',
})
export class ProductsTab {
  private readonly api = inject(ProtocolsApi);
  private readonly dialog = inject(MatDialog);
  protected readonly columns = ['name', 'kind', 'contactMinutes', 'staysWetMinutes', 'usedBy', 'actions'];
  protected readonly products = serverState(() => this.api.products(), 'The products could not be shown.');
  protected readonly message = signal<string | null>(null);
  /** The last save's non-blocking remarks (e.g. the short-contact caution). */
  protected readonly warnings = signal<string[]>([]);
  protected readonly retiring = action((product: ProductView) => this.api.retireProduct(product.id));
  protected readonly view = tableView(
    computed(() => this.products.value() ?? []),
    (product) => `${product.name} ${PRODUCT_KIND_LABELS[product.kind]} ${product.registration} ${product.usedBy.join(' ')}`,
    (product, column) =>
      column === 'kind' ? PRODUCT_KIND_LABELS[product.kind] : column === 'contactMinutes' || column === 'staysWetMinutes' ? (product[column] ?? 0) : product.name,
  );

  constructor() {
    this.products.show('all');
  }

  protected kindLabel(product: ProductView): string {
    return PRODUCT_KIND_LABELS[product.kind];
  }

  protected async edit(product: ProductView | null): Promise<void> {
    const saved: ProductAnswer | undefined = await firstValueFrom(this.dialog.open(ProductDialog, { data: product, autoFocus: 'first-tabbable' }).afterClosed());
    if (!saved) return;
    this.warnings.set(saved.warnings.map((w) => `${saved.product.name}: ${w.message}`));
    this.products.reload();
  }

  protected async retire(product: ProductView): Promise<void> {
    const data: ConfirmData = {
      title: `Retire ${product.name}?`,
      text: 'It can no longer be chosen in a protocol. Past turnovers and the cleaning log keep it.',
      confirm: 'Retire product',
    };
    if (!(await firstValueFrom(this.dialog.open(ConfirmDialog, { data }).afterClosed()))) return;
    this.message.set(null);
    const result = await this.retiring.run(product);
    if (result.status === 'done') {
      this.products.reload();
      return;
    }
    const error = result.error;
    this.message.set(
      hasErrorCode(error, 'product_in_use')
        ? `${product.name} is still used by the ${error.details.modalities.join(', ')} protocol (current or scheduled): choose another product there first.`
        : error.message,
    );
  }
}

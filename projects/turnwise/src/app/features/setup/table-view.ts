import { Signal, computed, signal } from '@angular/core';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';

export interface TableView<T> {
  readonly filter: Signal<string>;
  readonly sort: Signal<Sort>;
  readonly pageIndex: Signal<number>;
  readonly pageSize: Signal<number>;
  /** Rows matching the filter (the paginator's length). */
  readonly matching: Signal<T[]>;
  /** The rows on screen: filtered, sorted, this page. */
  readonly visible: Signal<T[]>;
  setFilter(text: string): void;
  setSort(sort: Sort): void;
  setPage(page: PageEvent): void;
}

/**
 * Filter, sort and page a list held in a signal, for Setup's Material tables. Done here rather
 * than in MatTableDataSource so every step is a signal the OnPush screen redraws from.
 */
export function tableView<T>(rows: Signal<T[]>, text: (row: T) => string, value: (row: T, column: string) => string | number, pageSize = 10): TableView<T> {
  const filter = signal('');
  const sort = signal<Sort>({ active: '', direction: '' });
  const pageIndex = signal(0);
  const size = signal(pageSize);
  const matching = computed(() => {
    const wanted = filter().trim().toLowerCase();
    return wanted === '' ? rows() : rows().filter((row) => text(row).toLowerCase().includes(wanted));
  });
  const sorted = computed(() => {
    const { active, direction } = sort();
    if (!active || !direction) return matching();
    const sign = direction === 'asc' ? 1 : -1;
    return [...matching()].sort((a, b) => {
      const x = value(a, active);
      const y = value(b, active);
      return sign * (typeof x === 'number' && typeof y === 'number' ? x - y : String(x).localeCompare(String(y), undefined, { numeric: true }));
    });
  });
  return {
    filter: filter.asReadonly(),
    sort: sort.asReadonly(),
    pageIndex: pageIndex.asReadonly(),
    pageSize: size.asReadonly(),
    matching,
    visible: computed(() => sorted().slice(pageIndex() * size(), (pageIndex() + 1) * size())),
    setFilter(next) {
      filter.set(next);
      pageIndex.set(0);
    },
    setSort: (next) => sort.set(next),
    setPage(page) {
      pageIndex.set(page.pageIndex);
      size.set(page.pageSize);
    },
  };
}

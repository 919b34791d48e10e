import { type ResourceRef, type Signal, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder } from '@angular/forms';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';
import { type Observable, debounceTime, distinctUntilChanged, map } from 'rxjs';
import type { Page } from '../../../shared/api-types';
import type { StockListQuery } from '../../../shared/schemas/stock';
import type { MaterialGroup } from '../../../shared/vocabulary';
import { latestValue } from '../core/api/latest-value';

/** How long the search box waits for typing to pause before asking the server. */
export const STOCK_SEARCH_DEBOUNCE_MS = 300;

/**
 * The state of one server-side stock table: search, group and archived filters, sort, page
 * and the page of records last loaded. Create it in a field initializer (it needs the
 * injection context for its subscriptions).
 */
export class StockListState<T> {
  private readonly fb = inject(NonNullableFormBuilder);

  readonly search = this.fb.control('');
  readonly groupFilter = this.fb.control<MaterialGroup | ''>('');
  readonly archivedFilter = this.fb.control<StockListQuery['archived']>('no');
  readonly pageSizeOptions = [10, 25, 50, 100];

  private readonly q = toSignal(
    this.search.valueChanges.pipe(
      map((text) => text.trim()),
      debounceTime(STOCK_SEARCH_DEBOUNCE_MS),
      distinctUntilChanged(),
    ),
    { initialValue: '' },
  );
  private readonly group = toSignal(this.groupFilter.valueChanges, { initialValue: this.groupFilter.value });
  private readonly archived = toSignal(this.archivedFilter.valueChanges, { initialValue: this.archivedFilter.value });
  readonly sort = signal<{ active: string; direction: 'asc' | 'desc' }>({ active: 'name', direction: 'asc' });
  readonly pageSize = signal(25);
  /** Back to the first page whenever the filters or the order change. */
  readonly pageIndex = linkedSignal({
    source: () => [this.q(), this.group(), this.archived(), this.sort(), this.pageSize()] as const,
    computation: () => 0,
  });
  private readonly query = computed<Partial<StockListQuery>>(() => ({
    page: this.pageIndex(),
    pageSize: this.pageSize(),
    sort: this.sort().active,
    dir: this.sort().direction,
    q: this.q() || undefined,
    group: this.group() || undefined,
    archived: this.archived(),
  }));
  private readonly page: ResourceRef<Page<T> | undefined>;

  readonly loading: Signal<boolean>;
  /** The error interceptor has already told the user what went wrong; the last rows stay. */
  readonly loadFailed: Signal<boolean>;
  readonly result: Signal<Page<T>>;

  constructor(
    load: (query: Partial<StockListQuery>) => Observable<Page<T>>,
    /** Column ids the server sorts by; other headers are not sortable. */
    private readonly sortable: readonly string[],
  ) {
    this.page = rxResource({ params: this.query, stream: ({ params }) => load(params) });
    this.loading = computed(() => this.page.isLoading());
    this.loadFailed = computed(() => !!this.page.error());
    this.result = latestValue(this.page, { items: [], total: 0, page: 0, pageSize: 25 });
  }

  changeSort(sort: Sort): void {
    const active = this.sortable.includes(sort.active) && sort.direction ? sort.active : 'name';
    this.sort.set({ active, direction: sort.direction === 'desc' ? 'desc' : 'asc' });
  }

  changePage(event: PageEvent): void {
    if (event.pageSize !== this.pageSize()) {
      this.pageSize.set(event.pageSize);
    } else {
      this.pageIndex.set(event.pageIndex);
    }
  }

  clearSearch(): void {
    this.search.setValue('');
  }

  reload(): void {
    this.page.reload();
  }
}

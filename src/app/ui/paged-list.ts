import { type ResourceRef, type Signal, type WritableSignal, computed, inject, linkedSignal, signal } from '@angular/core';
import { rxResource, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder } from '@angular/forms';
import type { PageEvent } from '@angular/material/paginator';
import type { Sort } from '@angular/material/sort';
import { type Observable, debounceTime, distinctUntilChanged, map } from 'rxjs';
import type { Page } from '@shared/api-types';
import { latestValue } from '../core/api/latest-value';

/** How long a list's search box waits for typing to pause before asking the server. */
export const LIST_SEARCH_DEBOUNCE_MS = 300;

/** What every server-side list takes; the caller's filters come on top. */
export interface ListQuery<S extends string = string> {
  page: number;
  pageSize: number;
  sort: S;
  dir: 'asc' | 'desc';
  q?: string;
}

export interface PagedListOptions<T, F extends object, S extends string> {
  load: (query: ListQuery<S> & F) => Observable<Page<T>>;
  /** The caller's filters as they are now (read from its own signals). */
  filters: () => F;
  /** Column ids the server sorts by; other headers are not sortable. */
  sortable: readonly S[];
  defaultSort: S;
}

/** What a paged table reads from a list: the rows, where it stands, and how to turn the page. */
export interface PagedSource<T> {
  result: Signal<Page<T>>;
  pageIndex: Signal<number>;
  pageSize: Signal<number>;
  pageSizeOptions: readonly number[];
  loading: Signal<boolean>;
  loadFailed: Signal<boolean>;
  changePage(event: PageEvent): void;
}

/**
 * A list the server searches, sorts and pages (people, stock): the search box, the order, the
 * page and the rows last loaded, which stay on screen while the next page loads. Any change
 * of search, filters, order or page size goes back to the first page. Create it in a field
 * initializer: it needs the injection context.
 */
export class PagedList<T, F extends object = object, S extends string = string> implements PagedSource<T> {
  readonly search = inject(NonNullableFormBuilder).control('');
  readonly pageSizeOptions = [10, 25, 50, 100];
  private readonly q = toSignal(
    this.search.valueChanges.pipe(
      map((text) => text.trim()),
      debounceTime(LIST_SEARCH_DEBOUNCE_MS),
      distinctUntilChanged(),
    ),
    { initialValue: '' },
  );
  readonly sort: WritableSignal<{ active: S; direction: 'asc' | 'desc' }>;
  readonly pageSize = signal(25);
  readonly pageIndex: WritableSignal<number>;

  private readonly rows: ResourceRef<Page<T> | undefined>;
  readonly loading: Signal<boolean>;
  /** The error interceptor has already told the user what went wrong; the last rows stay. */
  readonly loadFailed: Signal<boolean>;
  readonly result: Signal<Page<T>>;

  constructor(private readonly options: PagedListOptions<T, F, S>) {
    this.sort = signal({ active: options.defaultSort, direction: 'asc' });
    this.pageIndex = linkedSignal({
      source: () => [this.q(), options.filters(), this.sort(), this.pageSize()] as const,
      computation: () => 0,
    });
    const query = computed<ListQuery<S> & F>(() => ({
      page: this.pageIndex(),
      pageSize: this.pageSize(),
      sort: this.sort().active,
      dir: this.sort().direction,
      q: this.q() || undefined,
      ...options.filters(),
    }));
    this.rows = rxResource({ params: query, stream: ({ params }) => options.load(params) });
    this.loading = computed(() => this.rows.isLoading());
    this.loadFailed = computed(() => !!this.rows.error());
    this.result = latestValue(this.rows, { items: [], total: 0, page: 0, pageSize: 25 });
  }

  changeSort(sort: Sort): void {
    const active = (sort.direction && this.options.sortable.find((field) => field === sort.active)) || this.options.defaultSort;
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

  /** The same page again, after a record changed. */
  reload(): void {
    this.rows.reload();
  }
}

import { inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder } from '@angular/forms';
import type { Observable } from 'rxjs';
import type { Page } from '@shared/api-types';
import type { StockListQuery } from '@shared/schemas/stock';
import type { MaterialGroup } from '@shared/vocabulary';
import { PagedList } from '../ui/paged-list';

type StockFilters = Pick<StockListQuery, 'group' | 'archived'>;

/**
 * The state of one server-side stock table: a paged list by name, with the group and archived
 * filters every stock kind offers. Create it in a field initializer (it needs the injection
 * context for its subscriptions).
 */
export class StockListState<T> extends PagedList<T, StockFilters> {
  readonly groupFilter = inject(NonNullableFormBuilder).control<MaterialGroup | ''>('');
  readonly archivedFilter = inject(NonNullableFormBuilder).control<StockListQuery['archived']>('no');
  private readonly group = toSignal(this.groupFilter.valueChanges, { initialValue: this.groupFilter.value });
  private readonly archived = toSignal(this.archivedFilter.valueChanges, { initialValue: this.archivedFilter.value });

  constructor(
    load: (query: Partial<StockListQuery>) => Observable<Page<T>>,
    /** Column ids the server sorts by; other headers are not sortable. */
    sortable: readonly string[],
  ) {
    super({ load, sortable, defaultSort: 'name', filters: () => ({ group: this.group() || undefined, archived: this.archived() }) });
  }
}

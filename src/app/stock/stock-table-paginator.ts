import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatPaginatorModule } from '@angular/material/paginator';
import type { StockListState } from './stock-list-state';

/** The paginator under a stock table, wired to the table's list state. */
@Component({
  selector: 'kb-stock-table-paginator',
  imports: [MatPaginatorModule],
  template: `
    <mat-paginator
      [length]="list().result().total"
      [pageIndex]="list().pageIndex()"
      [pageSize]="list().pageSize()"
      [pageSizeOptions]="list().pageSizeOptions"
      (page)="list().changePage($event)"
      [attr.aria-label]="label()"
    />
  `,
  styles: ':host { display: block; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockTablePaginator {
  readonly list = input.required<StockListState<unknown>>();
  /** The paginator's accessible name, e.g. "Pages of materials". */
  readonly label = input.required<string>();
}

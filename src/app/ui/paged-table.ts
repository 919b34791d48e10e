import { ChangeDetectionStrategy, Component, computed, contentChildren, effect, input, output, viewChild } from '@angular/core';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatColumnDef, MatTable, MatTableModule } from '@angular/material/table';
import type { PagedSource } from './paged-list';

/**
 * A table the server sorts and pages, in the frame every list uses: progress bar while a page
 * loads, sideways scrolling, a row saying why it is empty, the paginator. The caller declares
 * the columns (`<ng-container matColumnDef>`) as content and puts `matSort` on this element,
 * so its sortable headers find their sort state. The rows and paging come from a PagedList
 * (`list`) or, for state kept elsewhere (the library keeps it in the URL), input by input.
 */
@Component({
  selector: 'kb-paged-table',
  imports: [MatPaginatorModule, MatProgressBarModule, MatTableModule],
  template: `
    @let v = view();
    <div class="kb-table-frame">
      @if (v.loading) {
        <mat-progress-bar mode="indeterminate" [attr.aria-label]="loadingLabel()" />
      }
      <div class="kb-table-scroll">
        <table mat-table [dataSource]="v.rows" [attr.aria-label]="label()" [style.min-width.px]="minWidth()">
          <tr mat-header-row *matHeaderRowDef="columns(); sticky: stickyHeader()"></tr>
          <tr
            mat-row
            *matRowDef="let row; columns: columns()"
            [class.kb-row]="clickableRows()"
            [class.kb-row-muted]="muted()(row)"
            (click)="clickableRows() && rowClick.emit(row)"
          ></tr>
          <tr class="mat-mdc-row" *matNoDataRow>
            <td class="mat-mdc-cell kb-empty" [attr.colspan]="columns().length">
              @if (v.failed) {
                {{ failedText() }}
              } @else if (!v.loading) {
                {{ emptyText() }}
              }
            </td>
          </tr>
        </table>
      </div>
      <!-- Optionally not before the first answer: a paginator pushed down by the arriving rows is a layout shift. -->
      @if (!paginatorAfterFirstPage() || !v.loading || v.rows.length) {
        <mat-paginator
          [length]="v.total"
          [pageIndex]="v.pageIndex"
          [pageSize]="v.pageSize"
          [pageSizeOptions]="v.pageSizeOptions"
          (page)="turnPage($event)"
          [attr.aria-label]="pagesLabel()"
        />
      }
    </div>
  `,
  styles: `
    :host {
      display: block;
    }
    table {
      width: 100%;
    }
    .kb-row {
      cursor: pointer;

      &:hover {
        background: var(--mat-sys-surface-container-low);
      }
    }
    .kb-row-muted {
      --mat-table-row-item-label-text-color: var(--mat-sys-on-surface-variant);
    }
    .kb-empty {
      padding: 24px 16px;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PagedTable<T> {
  readonly list = input<PagedSource<T> | null>(null);
  readonly rows = input<readonly T[]>([]);
  /** Column ids in order; each needs a column definition. */
  readonly columns = input.required<readonly string[]>();
  /** The table's accessible name, e.g. "Recipes". */
  readonly label = input.required<string>();
  readonly loading = input(false);
  readonly loadingLabel = input.required<string>();
  readonly failed = input(false);
  readonly failedText = input.required<string>();
  readonly emptyText = input.required<string>();
  readonly total = input(0);
  readonly pageIndex = input(0);
  readonly pageSize = input(25);
  readonly pageSizeOptions = input<readonly number[]>([10, 25, 50, 100]);
  /** The paginator's accessible name, e.g. "Pages of recipes". */
  readonly pagesLabel = input.required<string>();
  readonly paginatorAfterFirstPage = input(false);
  readonly stickyHeader = input(false);
  /** Wide tables scroll sideways below this width instead of squeezing their columns. */
  readonly minWidth = input<number | null>(null);
  /** Rows that open something when clicked (they get the class `kb-row`). */
  readonly clickableRows = input(false);
  /** Rows shown in the muted colour (archived records, inactive people). */
  readonly muted = input<(row: T) => boolean>(() => false);
  /** Column definitions a wrapping component declares on its caller's behalf. */
  readonly moreColumns = input<readonly MatColumnDef[]>([]);

  readonly page = output<PageEvent>();
  readonly rowClick = output<T>();

  protected readonly view = computed(() => {
    const list = this.list();
    return list
      ? {
          rows: list.result().items,
          total: list.result().total,
          pageIndex: list.pageIndex(),
          pageSize: list.pageSize(),
          pageSizeOptions: list.pageSizeOptions,
          loading: list.loading(),
          failed: list.loadFailed(),
        }
      : {
          rows: this.rows(),
          total: this.total(),
          pageIndex: this.pageIndex(),
          pageSize: this.pageSize(),
          pageSizeOptions: this.pageSizeOptions(),
          loading: this.loading(),
          failed: this.failed(),
        };
  });

  private readonly table = viewChild.required(MatTable);
  private readonly ownColumns = contentChildren(MatColumnDef);

  constructor() {
    // The definitions are this component's content, not the inner table's: hand them over.
    effect(() => {
      const table = this.table();
      for (const def of [...this.ownColumns(), ...this.moreColumns()]) table.addColumnDef(def);
    });
  }

  protected turnPage(event: PageEvent): void {
    const list = this.list();
    if (list) list.changePage(event);
    else this.page.emit(event);
  }
}

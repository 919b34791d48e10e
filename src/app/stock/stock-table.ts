import { ChangeDetectionStrategy, Component, computed, contentChildren, effect, inject, input, output } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSort, MatSortModule } from '@angular/material/sort';
import { MatColumnDef, MatTableModule } from '@angular/material/table';
import { hasAccess } from '@shared/roles';
import { STOCK_EDITORS } from '../core/api/stock-api';
import { Session } from '../core/session/session';
import { PagedTable } from '../ui/paged-table';
import type { StockListState } from './stock-list-state';
import type { StockRowHandlers } from './stock-record-actions';
import { StockRowActions } from './stock-row-actions';

type StockRecord = { id: number; name: string; archived: boolean; notes?: string };

/**
 * One stock list (materials, wheels or machines): search, archived filter and the add button
 * above a server-sorted, paged table with a menu of actions on each row for those who may
 * edit. The caller declares its columns as content (their sortable headers find the sort on
 * this element, kept in step with the list) and may add filters of its own (`kbStockFilter`),
 * shown between the search and the archived filter.
 */
@Component({
  selector: 'kb-stock-table',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    PagedTable,
    ReactiveFormsModule,
    StockRowActions,
  ],
  template: `
    @let state = list();
    <div class="kb-toolbar-row" role="search" [attr.aria-label]="'Filter ' + plural()">
      <mat-form-field class="kb-search">
        <mat-label>Search</mat-label>
        <mat-icon matPrefix aria-hidden="true">search</mat-icon>
        <input matInput [formControl]="state.search" [placeholder]="searchPlaceholder()" autocomplete="off" />
        @if (state.search.value) {
          <button matIconButton matSuffix type="button" (click)="state.clearSearch()" aria-label="Clear search">
            <mat-icon>close</mat-icon>
          </button>
        }
      </mat-form-field>
      <ng-content select="[kbStockFilter]" />
      <mat-form-field>
        <mat-label>Archived</mat-label>
        <mat-select [formControl]="state.archivedFilter">
          <mat-option value="no">In use</mat-option>
          <mat-option value="yes">Archived only</mat-option>
          <mat-option value="all">All</mat-option>
        </mat-select>
      </mat-form-field>
      @if (canEdit()) {
        <button matButton="filled" type="button" class="kb-add" (click)="add.emit()">
          <mat-icon>add</mat-icon>
          Add {{ noun() }}
        </button>
      }
    </div>

    <kb-paged-table
      [list]="state"
      [columns]="shownColumns()"
      [label]="title()"
      [loadingLabel]="'Loading ' + plural()"
      [failedText]="'The ' + plural() + ' could not be loaded.'"
      [emptyText]="'No ' + noun() + ' matches these filters.'"
      [pagesLabel]="'Pages of ' + plural()"
      [muted]="isArchived"
      [moreColumns]="columnDefs()"
    >
      <ng-container matColumnDef="name">
        <th mat-header-cell *matHeaderCellDef mat-sort-header>Name</th>
        <td mat-cell *matCellDef="let record">
          <span class="kb-name">{{ record.name }}</span>
          @if (record.archived) {
            <span class="kb-tag kb-tag-archived">Archived</span>
          }
          @if (withNotes() && record.notes) {
            <span class="kb-sub">{{ record.notes }}</span>
          }
        </td>
      </ng-container>

      <ng-container matColumnDef="actions">
        <th mat-header-cell *matHeaderCellDef><span class="kb-visually-hidden">Actions</span></th>
        <td mat-cell *matCellDef="let record" class="kb-actions">
          <kb-stock-row-actions
            [record]="record"
            (edit)="edit.emit(record)"
            (archive)="rowHandlers().archive(record)"
            (unarchive)="rowHandlers().unarchive(record)"
            (delete)="rowHandlers().remove(record)"
          />
        </td>
      </ng-container>
    </kb-paged-table>
  `,
  styleUrl: './stock-table.scss',
  hostDirectives: [MatSort],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockTable<T extends StockRecord> {
  private readonly session = inject(Session);

  readonly list = input.required<StockListState<T>>();
  readonly rowHandlers = input.required<StockRowHandlers<T>>();
  /** "material": in the add button and the empty-table line. */
  readonly noun = input.required<string>();
  /** "materials": in the accessible names and the failure line. */
  readonly plural = input.required<string>();
  readonly searchPlaceholder = input.required<string>();
  /** The caller's column ids, after the name; the actions column follows for those who may edit. */
  readonly columns = input.required<readonly string[]>();
  /** Show the record's notes under its name. */
  readonly withNotes = input(false);

  readonly add = output<void>();
  readonly edit = output<T>();

  protected readonly columnDefs = contentChildren(MatColumnDef);
  protected readonly canEdit = computed(() => hasAccess(this.session.roles(), STOCK_EDITORS));
  protected readonly shownColumns = computed(() => ['name', ...this.columns(), ...(this.canEdit() ? ['actions'] : [])]);
  protected readonly title = computed(() => this.plural().charAt(0).toUpperCase() + this.plural().slice(1));
  protected readonly isArchived = (record: T) => record.archived;

  constructor() {
    const sort = inject(MatSort, { self: true });
    sort.disableClear = true;
    effect(() => {
      const { active, direction } = this.list().sort();
      sort.active = active;
      sort.direction = direction;
    });
    sort.sortChange.pipe(takeUntilDestroyed()).subscribe((change) => this.list().changeSort(change));
  }
}

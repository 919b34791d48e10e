import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { firstValueFrom, forkJoin } from 'rxjs';
import { hasAccess } from '@shared/roles';
import type { SelectionRow, WheelRecord } from '@shared/stock-types';
import { MATERIAL_GROUPS, MATERIAL_GROUP_LABELS } from '@shared/vocabulary';
import { latestValue } from '../core/api/latest-value';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { ConfirmDialog, type ConfirmDialogData } from '../ui/confirm-dialog';
import { STOCK_EDITORS, StockApi } from '../core/api/stock-api';
import { SelectionRowDialog, type SelectionRowDialogData } from './selection-row-dialog';

/** A row of the table as shown: the wheel looked up by id. */
interface ShownRow {
  row: SelectionRow;
  groupLabel: string;
  /** First row of its group: the group name is printed only there. */
  firstOfGroup: boolean;
  band: string;
  wheel: WheelRecord | undefined;
}

/** Stock › Wheel selection: the lab's own table of material group × hardness band → wheel, from which the editor suggests wheels. */
@Component({
  selector: 'kb-wheel-selection',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, MatTableModule],
  templateUrl: './wheel-selection.html',
  styleUrls: ['./stock-table.scss', './wheel-selection.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WheelSelection {
  private readonly api = inject(StockApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);

  protected readonly canEdit = computed(() => hasAccess(this.session.roles(), STOCK_EDITORS));
  protected readonly columns = computed(() => {
    const base = ['group', 'band', 'wheel', 'note'];
    return this.canEdit() ? [...base, 'actions'] : base;
  });
  /** The table's rows, with every wheel (archived ones too: an old row may still name one). */
  private readonly table = rxResource({
    stream: () => forkJoin({ rows: this.api.selectionRows(), wheels: this.api.wheels.list({ pageSize: 200, archived: 'all' }) }),
  });
  /** The rows last loaded stay while the table is asked again and when that fails. */
  private readonly loaded = latestValue(this.table, { rows: [] as SelectionRow[], wheels: { items: [] as WheelRecord[], total: 0, page: 0, pageSize: 200 } });
  protected readonly loading = computed(() => this.table.isLoading());
  /** The error interceptor has said why. */
  protected readonly loadFailed = computed(() => !!this.table.error());
  private readonly rows = computed(() => this.loaded().rows);
  private readonly wheels = computed(() => this.loaded().wheels.items);

  protected readonly shown = computed<ShownRow[]>(() => {
    const wheels = new Map(this.wheels().map((w) => [w.id, w]));
    const sorted = [...this.rows()].sort(
      (a, b) => MATERIAL_GROUPS.indexOf(a.group) - MATERIAL_GROUPS.indexOf(b.group) || (a.hardness?.min ?? -1) - (b.hardness?.min ?? -1),
    );
    return sorted.map((row, i) => ({
      row,
      groupLabel: MATERIAL_GROUP_LABELS[row.group],
      firstOfGroup: i === 0 || sorted[i - 1].group !== row.group,
      band: row.hardness ? `${row.hardness.min}–${row.hardness.max} ${row.hardness.scale}` : 'Any hardness',
      wheel: wheels.get(row.wheelId),
    }));
  });

  protected addRow(): void {
    this.openForm({ wheels: this.wheels() });
  }

  protected editRow(row: SelectionRow): void {
    this.openForm({ row, wheels: this.wheels() });
  }

  protected async removeRow(shown: ShownRow): Promise<void> {
    const ref = this.dialog.open<ConfirmDialog, ConfirmDialogData, boolean>(ConfirmDialog, {
      data: {
        title: 'Remove this row?',
        message: [
          `${shown.groupLabel}, ${shown.band} → ${shown.wheel?.name ?? 'wheel ' + shown.row.wheelId}.`,
          'Recipes keep the wheel they name; only the suggestion for new recipes changes.',
        ],
        confirmLabel: 'Remove',
      },
      width: '480px',
      maxWidth: '95vw',
    });
    if ((await firstValueFrom(ref.afterClosed())) !== true) return;
    try {
      await firstValueFrom(this.api.deleteSelectionRow(shown.row.id));
      void this.notifier.show('The row was removed.', 'OK', 5000);
      this.load();
    } catch {
      // Shown by the error interceptor.
    }
  }

  private openForm(data: SelectionRowDialogData): void {
    this.dialog
      .open<SelectionRowDialog, SelectionRowDialogData, SelectionRow>(SelectionRowDialog, { data, width: '620px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        void this.notifier.show(data.row ? 'The row was saved.' : 'The row was added.', 'OK', 5000);
        this.load();
      });
  }
  private load(): void {
    this.table.reload();
  }
}

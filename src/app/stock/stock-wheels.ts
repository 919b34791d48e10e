import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatMenuModule } from '@angular/material/menu';
import { MatPaginatorModule } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { hasAccess } from '../../../shared/roles';
import type { WheelRecord } from '../../../shared/stock-types';
import type { WheelKind } from '../../../shared/vocabulary';
import { Notifier } from '../core/notifier/notifier';
import { Session } from '../core/session/session';
import { QuantityPipe } from './quantity';
import { STOCK_EDITORS, StockApi } from './stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { WheelFormDialog, type WheelFormDialogData } from './wheel-form-dialog';

/** Stock › Wheels: the lab's own cut-off wheels with their marking, size and marked maximum speed. */
@Component({
  selector: 'kb-stock-wheels',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatMenuModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    QuantityPipe,
    ReactiveFormsModule,
  ],
  templateUrl: './stock-wheels.html',
  styleUrl: './stock-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockWheels {
  private readonly api = inject(StockApi);
  private readonly dialog = inject(MatDialog);
  private readonly notifier = inject(Notifier);
  private readonly session = inject(Session);
  private readonly actions = inject(StockRecordActions);

  protected readonly list = new StockListState<WheelRecord>((q) => this.api.wheels.list(q), ['name', 'kind', 'specification', 'diameterMm', 'thicknessMm', 'maxSpeedMs']);
  protected readonly canEdit = computed(() => hasAccess(this.session.roles(), STOCK_EDITORS));
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = computed(() => {
    const base = ['name', 'kind', 'specification', 'diameterMm', 'thicknessMm', 'boreMm', 'maxSpeedMs', 'dryAllowed'];
    return this.canEdit() ? [...base, 'actions'] : base;
  });
  protected readonly kindLabel = (kind: WheelKind) => (kind === 'rim' ? 'Rim (diamond/CBN)' : 'Bonded (consumable)');

  protected addWheel(): void {
    this.openForm({});
  }

  protected editWheel(wheel: WheelRecord): void {
    this.openForm({ wheel });
  }

  protected async archive(wheel: WheelRecord): Promise<void> {
    if (await this.actions.archive(this.api.wheels, wheel, 'wheel')) this.list.reload();
  }

  protected async unarchive(wheel: WheelRecord): Promise<void> {
    if (await this.actions.unarchive(this.api.wheels, wheel, 'wheel')) this.list.reload();
  }

  protected async remove(wheel: WheelRecord): Promise<void> {
    if (await this.actions.delete(this.api.wheels, wheel, 'wheel')) this.list.reload();
  }

  private openForm(data: WheelFormDialogData): void {
    this.dialog
      .open<WheelFormDialog, WheelFormDialogData, WheelRecord>(WheelFormDialog, { data, width: '680px', maxWidth: '95vw' })
      .afterClosed()
      .subscribe((saved) => {
        if (!saved) return;
        void this.notifier.show(data.wheel ? `Changes to ${saved.name} were saved.` : `${saved.name} was added.`, 'OK', 5000);
        this.list.reload();
      });
  }
}

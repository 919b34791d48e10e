import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import type { WheelRecord } from '@shared/stock-types';
import type { WheelKind } from '@shared/vocabulary';
import { Session } from '../core/session/session';
import { QuantityPipe } from '../ui/quantity';
import { StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockTable } from './stock-table';
import { WheelFormDialog, type WheelFormDialogData } from './wheel-form-dialog';

/** Stock › Wheels: the lab's own cut-off wheels with their marking, size and marked maximum speed. */
@Component({
  selector: 'kb-stock-wheels',
  imports: [MatSortModule, MatTableModule, QuantityPipe, StockTable],
  templateUrl: './stock-wheels.html',
  styleUrl: './stock-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockWheels {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  private readonly actions = inject(StockRecordActions);

  protected readonly list = new StockListState<WheelRecord>(
    (q) => this.api.wheels.list(q),
    ['name', 'kind', 'specification', 'diameterMm', 'thicknessMm', 'maxSpeedMs'],
  );
  protected readonly rows = this.actions.rowHandlers<WheelRecord>(this.api.wheels, 'wheel', () => this.list.reload());
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = ['kind', 'specification', 'diameterMm', 'thicknessMm', 'boreMm', 'maxSpeedMs', 'dryAllowed'];
  protected readonly kindLabel = (kind: WheelKind) => (kind === 'rim' ? 'Rim (diamond/CBN)' : 'Bonded (consumable)');

  protected openForm(data: WheelFormDialogData): void {
    this.actions.openForm(WheelFormDialog, data, { width: '680px', editing: !!data.wheel }, () => this.list.reload());
  }
}

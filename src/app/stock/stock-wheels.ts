import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { hasAccess } from '../../../shared/roles';
import type { WheelRecord } from '../../../shared/stock-types';
import type { WheelKind } from '../../../shared/vocabulary';
import { Session } from '../core/session/session';
import { QuantityPipe } from '../ui/quantity';
import { STOCK_EDITORS, StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockRowActions } from './stock-row-actions';
import { StockTablePaginator } from './stock-table-paginator';
import { WheelFormDialog, type WheelFormDialogData } from './wheel-form-dialog';

/** Stock › Wheels: the lab's own cut-off wheels with their marking, size and marked maximum speed. */
@Component({
  selector: 'kb-stock-wheels',
  imports: [
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    QuantityPipe,
    ReactiveFormsModule,
    StockRowActions,
    StockTablePaginator,
  ],
  templateUrl: './stock-wheels.html',
  styleUrl: './stock-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockWheels {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  private readonly actions = inject(StockRecordActions);

  protected readonly list = new StockListState<WheelRecord>((q) => this.api.wheels.list(q), ['name', 'kind', 'specification', 'diameterMm', 'thicknessMm', 'maxSpeedMs']);
  protected readonly rows = this.actions.rowHandlers<WheelRecord>(this.api.wheels, 'wheel', () => this.list.reload());
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

  private openForm(data: WheelFormDialogData): void {
    this.actions.openForm(WheelFormDialog, data, { width: '680px', editing: !!data.wheel }, () => this.list.reload());
  }
}

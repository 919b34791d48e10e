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
import type { MachineRecord } from '../../../shared/stock-types';
import {
  CLAMPING_METHOD_LABELS,
  CUT_MOTION_LABELS,
  type ClampingMethod,
  type CutMotion,
  MACHINE_CLASS_LABELS,
  type MachineClass,
} from '../../../shared/vocabulary';
import { Session } from '../core/session/session';
import { MachineFormDialog, type MachineFormDialogData } from './machine-form-dialog';
import { QuantityPipe } from '../ui/quantity';
import { STOCK_EDITORS, StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockRowActions } from './stock-row-actions';
import { StockTablePaginator } from './stock-table-paginator';

/** Stock › Machines: the lab's cut-off machines with their wheel, speed and feed ranges. */
@Component({
  selector: 'kb-stock-machines',
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
  templateUrl: './stock-machines.html',
  styleUrl: './stock-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockMachines {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  private readonly actions = inject(StockRecordActions);

  protected readonly list = new StockListState<MachineRecord>((q) => this.api.machines.list(q), ['name', 'machineClass', 'wheelDiameterMaxMm', 'rpmMax']);
  protected readonly rows = this.actions.rowHandlers<MachineRecord>(this.api.machines, 'machine', () => this.list.reload());
  protected readonly canEdit = computed(() => hasAccess(this.session.roles(), STOCK_EDITORS));
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = computed(() => {
    const base = ['name', 'machineClass', 'wheelDiameterMaxMm', 'flange', 'rpmMax', 'feed', 'motions', 'clamping'];
    return this.canEdit() ? [...base, 'actions'] : base;
  });
  protected readonly classLabel = (id: MachineClass) => MACHINE_CLASS_LABELS[id];
  protected readonly motionLabel = (id: CutMotion) => CUT_MOTION_LABELS[id];
  protected readonly clampingLabel = (id: ClampingMethod) => CLAMPING_METHOD_LABELS[id];

  protected addMachine(): void {
    this.openForm({});
  }

  protected editMachine(machine: MachineRecord): void {
    this.openForm({ machine });
  }

  private openForm(data: MachineFormDialogData): void {
    this.actions.openForm(MachineFormDialog, data, { width: '760px', editing: !!data.machine }, () => this.list.reload());
  }
}

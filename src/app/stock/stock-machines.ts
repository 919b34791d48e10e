import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import type { MachineRecord } from '@shared/stock-types';
import { CLAMPING_METHOD_LABELS, CUT_MOTION_LABELS, type ClampingMethod, type CutMotion, MACHINE_CLASS_LABELS, type MachineClass } from '@shared/vocabulary';
import { Session } from '../core/session/session';
import { MachineFormDialog, type MachineFormDialogData } from './machine-form-dialog';
import { QuantityPipe } from '../ui/quantity';
import { StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockTable } from './stock-table';

/** Stock › Machines: the lab's cut-off machines with their wheel, speed and feed ranges. */
@Component({
  selector: 'kb-stock-machines',
  imports: [MatSortModule, MatTableModule, QuantityPipe, StockTable],
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
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = ['machineClass', 'wheelDiameterMaxMm', 'flange', 'rpmMax', 'feed', 'motions', 'clamping'];
  protected readonly classLabel = (id: MachineClass) => MACHINE_CLASS_LABELS[id];
  protected readonly motionLabel = (id: CutMotion) => CUT_MOTION_LABELS[id];
  protected readonly clampingLabel = (id: ClampingMethod) => CLAMPING_METHOD_LABELS[id];

  protected openForm(data: MachineFormDialogData): void {
    this.actions.openForm(MachineFormDialog, data, { width: '760px', editing: !!data.machine }, () => this.list.reload());
  }
}

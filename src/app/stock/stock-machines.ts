import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import type { SpeedMismatch } from '@shared/spindle-speed';
import type { MachineRecord } from '@shared/stock-types';
import { CLAMPING_METHOD_LABELS, CUT_MOTION_LABELS, type ClampingMethod, type CutMotion, MACHINE_CLASS_LABELS, type MachineClass } from '@shared/vocabulary';
import { Session } from '../core/session/session';
import { MachineFormDialog, type MachineFormDialogData } from './machine-form-dialog';
import { QuantityPipe } from '../ui/quantity';
import { StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockTable } from './stock-table';

/**
 * Stock › Machines: the lab's cut-off machines with their wheel, speed and feed ranges, the
 * speed limit set on a spindle and who set it, and the lab's wheels each machine can turn above
 * their marking.
 */
@Component({
  selector: 'kb-stock-machines',
  imports: [MatIconModule, MatSortModule, MatTableModule, QuantityPipe, StockTable],
  templateUrl: './stock-machines.html',
  styleUrl: './stock-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockMachines {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  private readonly actions = inject(StockRecordActions);

  protected readonly list = new StockListState<MachineRecord>((q) => this.api.machines.list(q), ['name', 'machineClass', 'wheelDiameterMaxMm', 'rpmMax']);
  /** Which machines can over-speed which wheels; fetched again whenever a machine changes. */
  private readonly mismatches = rxResource({ stream: () => this.api.speedMismatches() });
  protected readonly rows = this.actions.rowHandlers<MachineRecord>(this.api.machines, 'machine', () => this.reload());
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = ['machineClass', 'wheelDiameterMaxMm', 'flange', 'rpmMax', 'feed', 'motions', 'clamping'];
  protected readonly classLabel = (id: MachineClass) => MACHINE_CLASS_LABELS[id];
  protected readonly motionLabel = (id: CutMotion) => CUT_MOTION_LABELS[id];
  protected readonly clampingLabel = (id: ClampingMethod) => CLAMPING_METHOD_LABELS[id];

  private readonly byMachine = computed(() => {
    const map = new Map<number, SpeedMismatch[]>();
    for (const m of this.mismatches.value() ?? []) map.set(m.machineId, [...(map.get(m.machineId) ?? []), m]);
    return map;
  });
  /** The lab's wheels this machine can turn above their marking. */
  protected readonly overspeeds = (machineId: number): SpeedMismatch[] => this.byMachine().get(machineId) ?? [];

  protected openForm(data: MachineFormDialogData): void {
    this.actions.openForm(MachineFormDialog, data, { width: '760px', editing: !!data.machine }, () => this.reload());
  }

  private reload(): void {
    this.list.reload();
    this.mismatches.reload();
  }
}

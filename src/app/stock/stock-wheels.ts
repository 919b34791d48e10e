import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatIconModule } from '@angular/material/icon';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import type { SpeedMismatch } from '@shared/spindle-speed';
import type { WheelRecord } from '@shared/stock-types';
import { WHEEL_RESTRICTION_LABELS, type WheelKind, type WheelRestriction } from '@shared/vocabulary';
import { Session } from '../core/session/session';
import { MarkedMaximumPipe } from '../ui/marked-maximum';
import { QuantityPipe } from '../ui/quantity';
import { StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockTable } from './stock-table';
import { WheelFormDialog, type WheelFormDialogData } from './wheel-form-dialog';

/**
 * Stock › Wheels: the lab's own cut-off wheels with their marking, size, marked maximum speed
 * (in the unit marked on the wheel), restriction marks, and the machines that can turn each
 * above its marking — seen here before the wheel is mounted.
 */
@Component({
  selector: 'kb-stock-wheels',
  imports: [MarkedMaximumPipe, MatIconModule, MatSortModule, MatTableModule, QuantityPipe, StockTable],
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
  /** Which machines can over-speed which wheels; fetched again whenever a wheel changes. */
  private readonly mismatches = rxResource({ stream: () => this.api.speedMismatches() });
  protected readonly rows = this.actions.rowHandlers<WheelRecord>(this.api.wheels, 'wheel', () => this.reload());
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = ['kind', 'specification', 'diameterMm', 'thicknessMm', 'boreMm', 'maxSpeedMs', 'dryAllowed', 'restrictions'];
  protected readonly kindLabel = (kind: WheelKind) => (kind === 'rim' ? 'Rim (diamond/CBN)' : 'Bonded (consumable)');
  protected readonly restrictionLabel = (id: WheelRestriction) => WHEEL_RESTRICTION_LABELS[id];

  private readonly byWheel = computed(() => {
    const map = new Map<number, SpeedMismatch[]>();
    for (const m of this.mismatches.value() ?? []) map.set(m.wheelId, [...(map.get(m.wheelId) ?? []), m]);
    return map;
  });
  /** The machines that can turn this wheel above its marking. */
  protected readonly overspeedOn = (wheelId: number): SpeedMismatch[] => this.byWheel().get(wheelId) ?? [];

  protected openForm(data: WheelFormDialogData): void {
    this.actions.openForm(WheelFormDialog, data, { width: '680px', editing: !!data.wheel }, () => this.reload());
  }

  private reload(): void {
    this.list.reload();
    this.mismatches.reload();
  }
}

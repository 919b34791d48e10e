import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import type { MaterialRecord } from '@shared/stock-types';
import { MATERIAL_GROUPS, MATERIAL_GROUP_LABELS, type MaterialGroup } from '@shared/vocabulary';
import { Session } from '../core/session/session';
import { MaterialFormDialog, type MaterialFormDialogData } from './material-form-dialog';
import { QuantityPipe } from '../ui/quantity';
import { StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockTable } from './stock-table';
import { LabDatePipe } from '../core/dates/lab-date-pipe';

/** Stock › Materials: the lab's materials with hardness and handling flags. */
@Component({
  selector: 'kb-stock-materials',
  imports: [
    LabDatePipe,
    MatFormFieldModule,
    MatIconModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
    QuantityPipe,
    ReactiveFormsModule,
    StockTable,
  ],
  templateUrl: './stock-materials.html',
  styleUrl: './stock-table.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StockMaterials {
  private readonly api = inject(StockApi);
  private readonly session = inject(Session);
  private readonly actions = inject(StockRecordActions);

  protected readonly list = new StockListState<MaterialRecord>((q) => this.api.materials.list(q), ['name', 'designation', 'group', 'condition', 'updatedAt']);
  protected readonly rows = this.actions.rowHandlers<MaterialRecord>(this.api.materials, 'material', () => this.list.reload());
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = ['designation', 'group', 'condition', 'hardness', 'flags', 'updatedAt'];
  protected readonly groups = MATERIAL_GROUPS.map((id) => ({ id, label: MATERIAL_GROUP_LABELS[id] }));
  protected readonly groupLabel = (group: MaterialGroup) => MATERIAL_GROUP_LABELS[group];

  protected openForm(data: MaterialFormDialogData): void {
    this.actions.openForm(MaterialFormDialog, data, { width: '680px', editing: !!data.material }, () => this.list.reload());
  }
}

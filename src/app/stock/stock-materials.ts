import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { DatePipe } from '@angular/common';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { MatSortModule } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import { MatTooltipModule } from '@angular/material/tooltip';
import { hasAccess } from '../../../shared/roles';
import type { MaterialRecord } from '../../../shared/stock-types';
import { MATERIAL_GROUPS, MATERIAL_GROUP_LABELS, type MaterialGroup } from '../../../shared/vocabulary';
import { Session } from '../core/session/session';
import { MaterialFormDialog, type MaterialFormDialogData } from './material-form-dialog';
import { QuantityPipe } from '../ui/quantity';
import { STOCK_EDITORS, StockApi } from '../core/api/stock-api';
import { StockListState } from './stock-list-state';
import { StockRecordActions } from './stock-record-actions';
import { StockRowActions } from './stock-row-actions';
import { StockTablePaginator } from './stock-table-paginator';

/** Stock › Materials: the lab's materials with hardness and handling flags. */
@Component({
  selector: 'kb-stock-materials',
  imports: [
    DatePipe,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    MatSortModule,
    MatTableModule,
    MatTooltipModule,
    QuantityPipe,
    ReactiveFormsModule,
    StockRowActions,
    StockTablePaginator,
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
  protected readonly canEdit = computed(() => hasAccess(this.session.roles(), STOCK_EDITORS));
  protected readonly units = computed(() => this.session.user()?.units ?? 'metric');
  protected readonly columns = computed(() => {
    const base = ['name', 'designation', 'group', 'condition', 'hardness', 'flags', 'updatedAt'];
    return this.canEdit() ? [...base, 'actions'] : base;
  });
  protected readonly groups = MATERIAL_GROUPS.map((id) => ({ id, label: MATERIAL_GROUP_LABELS[id] }));
  protected readonly groupLabel = (group: MaterialGroup) => MATERIAL_GROUP_LABELS[group];

  protected addMaterial(): void {
    this.openForm({});
  }

  protected editMaterial(material: MaterialRecord): void {
    this.openForm({ material });
  }

  private openForm(data: MaterialFormDialogData): void {
    this.actions.openForm(MaterialFormDialog, data, { width: '680px', editing: !!data.material }, () => this.list.reload());
  }
}

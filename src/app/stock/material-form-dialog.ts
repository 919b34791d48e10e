import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { hardnessValue, materialBody, materialGroup } from '../../../shared/schemas/stock';
import type { MaterialRecord } from '../../../shared/stock-types';
import { HARDNESS_SCALES, type HardnessScale, MATERIAL_GROUPS, MATERIAL_GROUP_LABELS, type MaterialGroup } from '../../../shared/vocabulary';
import { controlMessage } from '../core/forms/control-message';
import { zodValidator } from '../core/forms/zod-validator';
import { saveStockForm } from './save-stock-form';
import { StockApi } from '../core/api/stock-api';

export interface MaterialFormDialogData {
  /** The material to edit; absent to add one. */
  material?: MaterialRecord;
}

const fields = materialBody.shape;

/** Add or edit a material. Closes with the saved MaterialRecord. */
@Component({
  selector: 'kb-material-form-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './material-form-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialFormDialog {
  private readonly api = inject(StockApi);
  private readonly dialogRef = inject<MatDialogRef<MaterialFormDialog, MaterialRecord>>(MatDialogRef);
  private readonly material = inject<MaterialFormDialogData>(MAT_DIALOG_DATA).material;
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly isNew = !this.material;
  protected readonly groups = MATERIAL_GROUPS.map((id) => ({ id, label: MATERIAL_GROUP_LABELS[id] }));
  protected readonly scales = HARDNESS_SCALES;
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');

  protected readonly form = this.fb.group({
    name: [this.material?.name ?? '', zodValidator(fields.name)],
    designation: [this.material?.designation ?? '', zodValidator(fields.designation)],
    group: this.fb.control<MaterialGroup | ''>(this.material?.group ?? '', zodValidator(materialGroup)),
    condition: [this.material?.condition ?? '', zodValidator(fields.condition)],
    hardness: this.fb.group({
      value: this.fb.control<number | null>(this.material?.hardness?.value ?? null, zodValidator(hardnessValue.shape.value.nullable())),
      scale: this.fb.control<HardnessScale>(this.material?.hardness?.scale ?? 'HV'),
    }),
    coated: [this.material?.coated ?? false],
    caseHardened: [this.material?.caseHardened ?? false],
    caseDepthMm: this.fb.control<number | null>(this.material?.caseDepthMm ?? null, zodValidator(fields.caseDepthMm)),
    heatSensitive: [this.material?.heatSensitive ?? false],
    hazardousDust: [this.material?.hazardousDust ?? false],
    notes: [this.material?.notes ?? '', zodValidator(fields.notes)],
  });

  constructor() {
    // The case depth only means something for a case-hardened material.
    const syncCaseDepth = (caseHardened: boolean) => {
      const depth = this.form.controls.caseDepthMm;
      if (caseHardened) depth.enable({ emitEvent: false });
      else depth.disable({ emitEvent: false });
    };
    syncCaseDepth(this.form.controls.caseHardened.value);
    this.form.controls.caseHardened.valueChanges.pipe(takeUntilDestroyed()).subscribe(syncCaseDepth);
  }

  protected async save(): Promise<void> {
    const value = this.form.getRawValue();
    const saved = await saveStockForm({
      form: this.form,
      schema: materialBody,
      candidate: {
        ...value,
        hardness: value.hardness.value === null ? null : { value: value.hardness.value, scale: value.hardness.scale },
        caseDepthMm: value.caseHardened ? value.caseDepthMm : null,
      },
      resource: this.api.materials,
      id: this.material?.id,
      busy: this.busy,
      formError: this.formError,
    });
    if (saved) this.dialogRef.close(saved);
  }

}

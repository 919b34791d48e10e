import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { hardnessValue, materialBody, materialGroup } from '@shared/schemas/stock';
import type { MaterialRecord } from '@shared/stock-types';
import { HARDNESS_SCALES, type HardnessScale, MATERIAL_GROUPS, MATERIAL_GROUP_LABELS, type MaterialGroup } from '@shared/vocabulary';
import { zodValidator } from '../core/forms/zod-validator';
import { StockFormDialog } from './stock-form-dialog';
import { StockFormFrame } from './stock-form-frame';
import { DecimalInput } from '../ui/decimal-input';

export interface MaterialFormDialogData {
  /** The material to edit; absent to add one. */
  material?: MaterialRecord;
}

const fields = materialBody.shape;

/** Add or edit a material. Closes with the saved MaterialRecord. */
@Component({
  selector: 'kb-material-form-dialog',
  imports: [DecimalInput, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule, StockFormFrame],
  templateUrl: './material-form-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MaterialFormDialog extends StockFormDialog<MaterialRecord> {
  private readonly material = inject<MaterialFormDialogData>(MAT_DIALOG_DATA).material;

  protected readonly isNew = !this.material;
  protected readonly groups = MATERIAL_GROUPS.map((id) => ({ id, label: MATERIAL_GROUP_LABELS[id] }));
  protected readonly scales = HARDNESS_SCALES;

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
    coatingHardness: this.fb.group({
      value: this.fb.control<number | null>(this.material?.coatingHardness?.value ?? null, zodValidator(hardnessValue.shape.value.nullable())),
      scale: this.fb.control<HardnessScale>(this.material?.coatingHardness?.scale ?? 'HV'),
    }),
    caseHardened: [this.material?.caseHardened ?? false],
    caseDepthMm: this.fb.control<number | null>(this.material?.caseDepthMm ?? null, zodValidator(fields.caseDepthMm)),
    heatSensitive: [this.material?.heatSensitive ?? false],
    hazardousDust: [this.material?.hazardousDust ?? false],
    combustibleFines: [this.material?.combustibleFines ?? false],
    notes: [this.material?.notes ?? '', zodValidator(fields.notes)],
  });

  constructor() {
    super();
    // The case depth only means something for a case-hardened material.
    const syncCaseDepth = (caseHardened: boolean) => {
      const depth = this.form.controls.caseDepthMm;
      if (caseHardened) depth.enable({ emitEvent: false });
      else depth.disable({ emitEvent: false });
    };
    syncCaseDepth(this.form.controls.caseHardened.value);
    this.form.controls.caseHardened.valueChanges.pipe(takeUntilDestroyed()).subscribe(syncCaseDepth);
  }

  protected save(): Promise<void> {
    const value = this.form.getRawValue();
    const candidate = {
      ...value,
      hardness: value.hardness.value === null ? null : { value: value.hardness.value, scale: value.hardness.scale },
      caseDepthMm: value.caseHardened ? value.caseDepthMm : null,
      // Only a coated material keeps a coating hardness; unticking "coated" drops it.
      coatingHardness: value.coated && value.coatingHardness.value !== null ? { value: value.coatingHardness.value, scale: value.coatingHardness.scale } : null,
    };
    return this.saveWith(materialBody, candidate, this.api.materials, this.material?.id);
  }
}

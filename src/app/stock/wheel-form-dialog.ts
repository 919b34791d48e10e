import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { wheelBody } from '@shared/schemas/stock';
import type { WheelRecord } from '@shared/stock-types';
import { WHEEL_KINDS, WHEEL_KIND_LABELS, type WheelKind } from '@shared/vocabulary';
import { zodValidator } from '../core/forms/zod-validator';
import { StockFormDialog } from './stock-form-dialog';
import { StockFormFrame } from './stock-form-frame';

export interface WheelFormDialogData {
  /** The wheel to edit; absent to add one. */
  wheel?: WheelRecord;
}

const fields = wheelBody.shape;

/** Add or edit a wheel of the lab's stock. Closes with the saved WheelRecord. */
@Component({
  selector: 'kb-wheel-form-dialog',
  imports: [MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule, StockFormFrame],
  templateUrl: './wheel-form-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WheelFormDialog extends StockFormDialog<WheelRecord> {
  private readonly wheel = inject<WheelFormDialogData>(MAT_DIALOG_DATA).wheel;

  protected readonly isNew = !this.wheel;
  protected readonly kinds = WHEEL_KINDS.map((id) => ({ id, label: WHEEL_KIND_LABELS[id] }));

  protected readonly form = this.fb.group({
    name: [this.wheel?.name ?? '', zodValidator(fields.name)],
    kind: this.fb.control<WheelKind | ''>(this.wheel?.kind ?? '', zodValidator(fields.kind)),
    specification: [this.wheel?.specification ?? '', zodValidator(fields.specification)],
    diameterMm: this.fb.control<number | null>(this.wheel?.diameterMm ?? null, zodValidator(fields.diameterMm)),
    thicknessMm: this.fb.control<number | null>(this.wheel?.thicknessMm ?? null, zodValidator(fields.thicknessMm)),
    boreMm: this.fb.control<number | null>(this.wheel?.boreMm ?? null, zodValidator(fields.boreMm)),
    maxSpeedMs: this.fb.control<number | null>(this.wheel?.maxSpeedMs ?? null, zodValidator(fields.maxSpeedMs)),
    dryAllowed: [this.wheel?.dryAllowed ?? false],
    notes: [this.wheel?.notes ?? '', zodValidator(fields.notes)],
  });

  protected save(): Promise<void> {
    return this.saveWith(wheelBody, this.form.getRawValue(), this.api.wheels, this.wheel?.id);
  }
}

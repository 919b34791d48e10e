import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { wheelBody } from '../../../shared/schemas/stock';
import type { WheelRecord } from '../../../shared/stock-types';
import { WHEEL_KINDS, WHEEL_KIND_LABELS, type WheelKind } from '../../../shared/vocabulary';
import { controlMessage } from '../core/forms/control-message';
import { zodValidator } from '../core/forms/zod-validator';
import { saveStockForm } from './save-stock-form';
import { StockApi } from '../core/api/stock-api';

export interface WheelFormDialogData {
  /** The wheel to edit; absent to add one. */
  wheel?: WheelRecord;
}

const fields = wheelBody.shape;

/** Add or edit a wheel of the lab's stock. Closes with the saved WheelRecord. */
@Component({
  selector: 'kb-wheel-form-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './wheel-form-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WheelFormDialog {
  private readonly api = inject(StockApi);
  private readonly dialogRef = inject<MatDialogRef<WheelFormDialog, WheelRecord>>(MatDialogRef);
  private readonly wheel = inject<WheelFormDialogData>(MAT_DIALOG_DATA).wheel;
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly isNew = !this.wheel;
  protected readonly kinds = WHEEL_KINDS.map((id) => ({ id, label: WHEEL_KIND_LABELS[id] }));
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');

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

  protected async save(): Promise<void> {
    const saved = await saveStockForm({
      form: this.form,
      schema: wheelBody,
      candidate: this.form.getRawValue(),
      resource: this.api.wheels,
      id: this.wheel?.id,
      busy: this.busy,
      formError: this.formError,
    });
    if (saved) this.dialogRef.close(saved);
  }

}

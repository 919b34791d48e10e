import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { firstValueFrom } from 'rxjs';
import { hardnessWindow, materialGroup, selectionRowBody } from '@shared/schemas/stock';
import type { SelectionRow, WheelRecord } from '@shared/stock-types';
import { HARDNESS_SCALES, type HardnessScale, MATERIAL_GROUPS, MATERIAL_GROUP_LABELS, type MaterialGroup } from '@shared/vocabulary';
import { controlMessage } from '../core/forms/control-message';
import { applyServerErrors } from '../core/forms/server-errors';
import { zodValidator } from '../core/forms/zod-validator';
import { isApiError } from '../core/http/api-error';
import { callerHandles } from '../core/http/caller-handles';
import { StockApi } from '../core/api/stock-api';
import { checkWholeBody } from '../core/forms/whole-body-check';
import { DecimalInput } from '../ui/decimal-input';

export interface SelectionRowDialogData {
  /** The row to edit; absent to add one. */
  row?: SelectionRow;
  /** The lab's wheels; archived ones are offered only when the row already names one. */
  wheels: readonly WheelRecord[];
}

/** Add or edit one row of the wheel-selection table. Closes with the saved row. */
@Component({
  selector: 'kb-selection-row-dialog',
  imports: [DecimalInput, MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './selection-row-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SelectionRowDialog {
  private readonly api = inject(StockApi);
  private readonly dialogRef = inject<MatDialogRef<SelectionRowDialog, SelectionRow>>(MatDialogRef);
  private readonly data = inject<SelectionRowDialogData>(MAT_DIALOG_DATA);
  private readonly row = this.data.row;
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly isNew = !this.row;
  protected readonly groups = MATERIAL_GROUPS.map((id) => ({ id, label: MATERIAL_GROUP_LABELS[id] }));
  protected readonly scales = HARDNESS_SCALES;
  protected readonly wheels = this.data.wheels.filter((w) => !w.archived || w.id === this.row?.wheelId);
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');

  protected readonly form = this.fb.group({
    group: this.fb.control<MaterialGroup | ''>(this.row?.group ?? '', zodValidator(materialGroup)),
    anyHardness: [this.row ? this.row.hardness === null : true],
    hardness: this.fb.group({
      min: this.fb.control<number | null>(this.row?.hardness?.min ?? null, zodValidator(hardnessWindow.shape.min)),
      max: this.fb.control<number | null>(this.row?.hardness?.max ?? null, zodValidator(hardnessWindow.shape.max)),
      scale: this.fb.control<HardnessScale>(this.row?.hardness?.scale ?? 'HV'),
    }),
    wheelId: this.fb.control<number | null>(this.row?.wheelId ?? null, zodValidator(selectionRowBody.shape.wheelId)),
    note: [this.row?.note ?? '', zodValidator(selectionRowBody.shape.note)],
  });

  constructor() {
    const syncBand = (any: boolean) => {
      if (any) this.form.controls.hardness.disable({ emitEvent: false });
      else this.form.controls.hardness.enable({ emitEvent: false });
    };
    syncBand(this.form.controls.anyHardness.value);
    this.form.controls.anyHardness.valueChanges.pipe(takeUntilDestroyed()).subscribe(syncBand);
  }

  protected async save(): Promise<void> {
    this.formError.set('');
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const candidate = {
      group: value.group,
      hardness: value.anyHardness ? null : value.hardness,
      wheelId: value.wheelId,
      note: value.note,
    };
    const body = checkWholeBody(this.form, selectionRowBody, candidate, (messages) => this.formError.set(messages.join(' ')));
    if (!body) return;
    const context = callerHandles(400, 409);
    this.busy.set(true);
    try {
      const saved = this.row
        ? await firstValueFrom(this.api.updateSelectionRow(this.row.id, body, context))
        : await firstValueFrom(this.api.createSelectionRow(body, context));
      this.dialogRef.close(saved);
    } catch (e) {
      if (!isApiError(e)) throw e;
      if (e.status === 400 || e.status === 409) this.formError.set(applyServerErrors(this.form, e.errors).join(' '));
    } finally {
      this.busy.set(false);
    }
  }
}

import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { machineBody } from '../../../shared/schemas/stock';
import type { MachineRecord } from '../../../shared/stock-types';
import {
  CLAMPING_METHODS,
  CLAMPING_METHOD_LABELS,
  CUT_MOTIONS,
  CUT_MOTION_LABELS,
  type ClampingMethod,
  type CutMotion,
  MACHINE_CLASSES,
  MACHINE_CLASS_LABELS,
  type MachineClass,
} from '../../../shared/vocabulary';
import { controlMessage } from '../core/forms/control-message';
import { zodValidator } from '../core/forms/zod-validator';
import { saveStockForm } from './save-stock-form';
import { StockApi } from '../core/api/stock-api';

export interface MachineFormDialogData {
  /** The machine to edit; absent to add one. */
  machine?: MachineRecord;
}

const fields = machineBody.shape;

/** Add or edit a cut-off machine. Closes with the saved MachineRecord. */
@Component({
  selector: 'kb-machine-form-dialog',
  imports: [MatButtonModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatRadioModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './machine-form-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MachineFormDialog {
  private readonly api = inject(StockApi);
  private readonly dialogRef = inject<MatDialogRef<MachineFormDialog, MachineRecord>>(MatDialogRef);
  private readonly machine = inject<MachineFormDialogData>(MAT_DIALOG_DATA).machine;
  private readonly fb = inject(NonNullableFormBuilder);

  protected readonly isNew = !this.machine;
  protected readonly classes = MACHINE_CLASSES.map((id) => ({ id, label: MACHINE_CLASS_LABELS[id] }));
  protected readonly motions = CUT_MOTIONS.map((id) => ({ id, label: CUT_MOTION_LABELS[id] }));
  protected readonly clampings = CLAMPING_METHODS.map((id) => ({ id, label: CLAMPING_METHOD_LABELS[id] }));
  protected readonly controlMessage = controlMessage;
  protected readonly busy = signal(false);
  protected readonly formError = signal('');

  private number(value: number | undefined, schema: (typeof fields)[keyof typeof fields]) {
    return this.fb.control<number | null>(value ?? null, zodValidator(schema));
  }

  protected readonly form = this.fb.group({
    name: [this.machine?.name ?? '', zodValidator(fields.name)],
    machineClass: this.fb.control<MachineClass | ''>(this.machine?.machineClass ?? '', zodValidator(fields.machineClass)),
    wheelDiameterMinMm: this.number(this.machine?.wheelDiameterMinMm, fields.wheelDiameterMinMm),
    wheelDiameterMaxMm: this.number(this.machine?.wheelDiameterMaxMm, fields.wheelDiameterMaxMm),
    flangeDiameterMm: this.number(this.machine?.flangeDiameterMm, fields.flangeDiameterMm),
    rpmMin: this.number(this.machine?.rpmMin, fields.rpmMin),
    rpmMax: this.number(this.machine?.rpmMax, fields.rpmMax),
    feedMinMmS: this.number(this.machine?.feedMinMmS, fields.feedMinMmS),
    feedMaxMmS: this.number(this.machine?.feedMaxMmS, fields.feedMaxMmS),
    feedControl: this.fb.control<'manual' | 'automatic'>(this.machine?.feedControl ?? 'automatic'),
    cutMotions: this.fb.control<CutMotion[]>(this.machine?.cutMotions ?? [], zodValidator(fields.cutMotions)),
    clampingMethods: this.fb.control<ClampingMethod[]>(this.machine?.clampingMethods ?? [], zodValidator(fields.clampingMethods)),
    notes: [this.machine?.notes ?? '', zodValidator(fields.notes)],
  });

  protected async save(): Promise<void> {
    const saved = await saveStockForm({
      form: this.form,
      schema: machineBody,
      candidate: this.form.getRawValue(),
      resource: this.api.machines,
      id: this.machine?.id,
      busy: this.busy,
      formError: this.formError,
    });
    if (saved) this.dialogRef.close(saved);
  }

}

import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MAT_DIALOG_DATA } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import { machineBody } from '@shared/schemas/stock';
import type { MachineRecord } from '@shared/stock-types';
import {
  CLAMPING_METHODS,
  CLAMPING_METHOD_LABELS,
  CUT_MOTIONS,
  CUT_MOTION_LABELS,
  type ClampingMethod,
  type CutMotion,
  FEED_DIRECTIONS,
  FEED_DIRECTION_LABELS,
  type FeedDirection,
  MACHINE_CLASSES,
  MACHINE_CLASS_LABELS,
  type MachineClass,
} from '@shared/vocabulary';
import { zodValidator } from '../core/forms/zod-validator';
import { StockFormDialog } from './stock-form-dialog';
import { StockFormFrame } from './stock-form-frame';
import { DecimalInput } from '../ui/decimal-input';

export interface MachineFormDialogData {
  /** The machine to edit; absent to add one. */
  machine?: MachineRecord;
}

const fields = machineBody.shape;

/** Add or edit a cut-off machine. Closes with the saved MachineRecord. */
@Component({
  selector: 'kb-machine-form-dialog',
  imports: [DecimalInput, MatFormFieldModule, MatInputModule, MatRadioModule, MatSelectModule, ReactiveFormsModule, StockFormFrame],
  templateUrl: './machine-form-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MachineFormDialog extends StockFormDialog<MachineRecord> {
  private readonly machine = inject<MachineFormDialogData>(MAT_DIALOG_DATA).machine;

  protected readonly isNew = !this.machine;
  protected readonly classes = MACHINE_CLASSES.map((id) => ({ id, label: MACHINE_CLASS_LABELS[id] }));
  protected readonly motions = CUT_MOTIONS.map((id) => ({ id, label: CUT_MOTION_LABELS[id] }));
  protected readonly clampings = CLAMPING_METHODS.map((id) => ({ id, label: CLAMPING_METHOD_LABELS[id] }));
  protected readonly directions = FEED_DIRECTIONS.map((id) => ({ id, label: FEED_DIRECTION_LABELS[id] }));

  private number(value: number | null | undefined, schema: (typeof fields)[keyof typeof fields]) {
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
    feedDirection: this.fb.control<FeedDirection>(this.machine?.feedDirection ?? 'wheel-down'),
    spindleLimitRpm: this.number(this.machine?.spindleLimitRpm, fields.spindleLimitRpm),
    spindleLimitSetBy: [this.machine?.spindleLimitSetBy ?? '', zodValidator(fields.spindleLimitSetBy)],
    motorPowerKw: this.number(this.machine?.motorPowerKw, fields.motorPowerKw),
    cutMotions: this.fb.control<CutMotion[]>(this.machine?.cutMotions ?? [], zodValidator(fields.cutMotions)),
    clampingMethods: this.fb.control<ClampingMethod[]>(this.machine?.clampingMethods ?? [], zodValidator(fields.clampingMethods)),
    notes: [this.machine?.notes ?? '', zodValidator(fields.notes)],
  });

  protected save(): Promise<void> {
    return this.saveWith(machineBody, this.form.getRawValue(), this.api.machines, this.machine?.id);
  }
}

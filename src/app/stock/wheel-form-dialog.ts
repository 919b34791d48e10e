import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { wheelBody } from '@shared/schemas/stock';
import type { WheelRecord } from '@shared/stock-types';
import { markedSpeedPair } from '@shared/peripheral-speed';
import {
  SPEED_MARKINGS,
  type SpeedMarking,
  WHEEL_KINDS,
  WHEEL_KIND_LABELS,
  WHEEL_RESTRICTIONS,
  WHEEL_RESTRICTION_LABELS,
  type WheelKind,
  type WheelRestriction,
} from '@shared/vocabulary';
import { zodValidator } from '../core/forms/zod-validator';
import { StockFormDialog } from './stock-form-dialog';
import { StockFormFrame } from './stock-form-frame';
import { DecimalInput } from '../ui/decimal-input';

export interface WheelFormDialogData {
  /** The wheel to edit; absent to add one. */
  wheel?: WheelRecord;
}

const fields = wheelBody.shape;

/** Add or edit a wheel of the lab's stock. Closes with the saved WheelRecord. */
@Component({
  selector: 'kb-wheel-form-dialog',
  imports: [DecimalInput, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule, StockFormFrame],
  templateUrl: './wheel-form-dialog.html',
  styleUrl: './stock-form.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WheelFormDialog extends StockFormDialog<WheelRecord> {
  private readonly wheel = inject<WheelFormDialogData>(MAT_DIALOG_DATA).wheel;

  protected readonly isNew = !this.wheel;
  protected readonly kinds = WHEEL_KINDS.map((id) => ({ id, label: WHEEL_KIND_LABELS[id] }));
  protected readonly markings = SPEED_MARKINGS;
  protected readonly restrictionOptions = WHEEL_RESTRICTIONS.map((id) => ({ id, label: WHEEL_RESTRICTION_LABELS[id] }));

  protected readonly form = this.fb.group({
    name: [this.wheel?.name ?? '', zodValidator(fields.name)],
    kind: this.fb.control<WheelKind | ''>(this.wheel?.kind ?? '', zodValidator(fields.kind)),
    specification: [this.wheel?.specification ?? '', zodValidator(fields.specification)],
    diameterMm: this.fb.control<number | null>(this.wheel?.diameterMm ?? null, zodValidator(fields.diameterMm)),
    thicknessMm: this.fb.control<number | null>(this.wheel?.thicknessMm ?? null, zodValidator(fields.thicknessMm)),
    boreMm: this.fb.control<number | null>(this.wheel?.boreMm ?? null, zodValidator(fields.boreMm)),
    maxSpeedMarkedIn: this.fb.control<SpeedMarking>(this.wheel?.maxSpeedMarkedIn ?? 'm/s'),
    maxSpeedMs: this.fb.control<number | null>(this.wheel?.maxSpeedMs ?? null, zodValidator(fields.maxSpeedMs)),
    maxSpeedRpm: this.fb.control<number | null>(this.wheel?.maxSpeedRpm ?? null, zodValidator(fields.maxSpeedRpm)),
    dryAllowed: [this.wheel?.dryAllowed ?? false],
    restrictions: this.fb.control<WheelRestriction[]>(this.wheel?.restrictions ?? [], zodValidator(fields.restrictions)),
    minUsableDiameterMm: this.fb.control<number | null>(this.wheel?.minUsableDiameterMm ?? null, zodValidator(fields.minUsableDiameterMm)),
    notes: [this.wheel?.notes ?? '', zodValidator(fields.notes)],
  });

  private readonly values = toSignal(this.form.valueChanges, { initialValue: this.form.getRawValue() });

  /** The speed in the unit not marked, computed from the marked one and the diameter, for the hint. */
  protected readonly otherSpeed = computed(() => {
    const v = this.values();
    const marked = v.maxSpeedMarkedIn === 'rpm' ? v.maxSpeedRpm : v.maxSpeedMs;
    if (!v.diameterMm || !marked || v.diameterMm <= 0 || marked <= 0) return '';
    const pair = markedSpeedPair(v.diameterMm, v.maxSpeedMarkedIn ?? 'm/s', marked);
    return v.maxSpeedMarkedIn === 'rpm'
      ? `${pair.maxSpeedMs.toFixed(1)} m/s at ${v.diameterMm} mm`
      : `${Math.floor(pair.maxSpeedRpm)} rpm at ${v.diameterMm} mm`;
  });

  protected save(): Promise<void> {
    // Only the marked figure is sent; the server computes the other from the diameter.
    const value = this.form.getRawValue();
    const marked = value.maxSpeedMarkedIn === 'rpm' ? { maxSpeedMs: null } : { maxSpeedRpm: null };
    return this.saveWith(wheelBody, { ...value, ...marked }, this.api.wheels, this.wheel?.id);
  }
}

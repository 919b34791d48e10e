import { LowerCasePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatSelectModule } from '@angular/material/select';
import type { CheckResult } from '@shared/recipe-checks';
import type { HardnessValue } from '@shared/schemas/stock';
import type { MachineRecord, MaterialRecord, SelectionRow, WheelRecord } from '@shared/stock-types';
import { MACHINE_CLASS_LABELS, MATERIAL_GROUP_LABELS } from '@shared/vocabulary';
import { suggestWheels } from '@shared/wheel-suggestion';
import { controlMessage } from '../../../core/forms/control-message';
import type { CuttingGroup, FormContent } from '../recipe-form';
import { InlineChecks } from './inline-checks';

/** A wheel the chosen machine can mount (its diameter within the machine's range); any wheel while no machine is chosen. */
export function wheelFitsMachine(wheel: WheelRecord, machine: MachineRecord | null): boolean {
  return !machine || (wheel.diameterMm >= machine.wheelDiameterMinMm && wheel.diameterMm <= machine.wheelDiameterMaxMm);
}

/** Machine and wheel, with the wheels the lab's selection table suggests for the scope. */
@Component({
  selector: 'kb-machine-wheel-section',
  imports: [InlineChecks, LowerCasePipe, MatButtonModule, MatFormFieldModule, MatIconModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './machine-wheel-section.html',
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MachineWheelSection {
  readonly group = input.required<CuttingGroup>();
  readonly value = input.required<FormContent>();
  readonly machines = input.required<readonly MachineRecord[]>();
  readonly wheels = input.required<WheelRecord[]>();
  readonly selectionRows = input.required<SelectionRow[]>();
  readonly machine = input<MachineRecord | null>(null);
  readonly wheel = input<WheelRecord | null>(null);
  readonly material = input<MaterialRecord | null>(null);
  readonly locked = input(false);
  readonly checks = input<readonly CheckResult[]>();

  protected readonly controlMessage = controlMessage;
  protected readonly groupLabel = MATERIAL_GROUP_LABELS;
  protected readonly machineClassLabel = MACHINE_CLASS_LABELS;

  /** Wheels the lab's selection table offers for the scope's group and hardness; those the machine takes first. */
  protected readonly suggestions = computed(() => {
    const scope = this.value().scope;
    if (!scope.group) return [];
    let hardness: HardnessValue | null = null;
    const material = scope.by === 'material' ? this.material() : null;
    if (material?.hardness) hardness = material.hardness;
    else if (scope.hasHardness && scope.hardness.min !== null && scope.hardness.max !== null) {
      // A window is matched by its middle; the band check is a suggestion, not a rule.
      hardness = { value: (scope.hardness.min + scope.hardness.max) / 2, scale: scope.hardness.scale };
    }
    // Wheels the chosen machine takes come first; the others stay visible, marked.
    const fits = (w: WheelRecord) => this.fits(w);
    // A coated material's coating is cut too: the suggestion weighs its hardness as well.
    const coating = material?.coated ? (material.coatingHardness ?? null) : null;
    const all = suggestWheels(scope.group, hardness, this.selectionRows(), this.wheels(), coating);
    return [...all.filter((s) => fits(s.wheel)), ...all.filter((s) => !fits(s.wheel))].slice(0, 3).map((s) => ({ ...s, fits: fits(s.wheel) }));
  });

  protected fits(w: WheelRecord): boolean {
    return wheelFitsMachine(w, this.machine());
  }

  protected wheelLabel(w: WheelRecord): string {
    return `${w.name} · ${w.specification} · Ø${w.diameterMm} × ${w.thicknessMm} mm · max ${w.maxSpeedMs} m/s`;
  }

  protected applyWheel(wheelId: number): void {
    const control = this.group().controls.wheelId;
    control.setValue(wheelId);
    control.markAsDirty();
  }
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { CheckResult } from '@shared/recipe-checks';
import type { MachineRecord, MaterialRecord } from '@shared/stock-types';
import { CLAMPING_METHODS, CLAMPING_METHOD_LABELS, WHEEL_PATHS, WHEEL_PATH_LABELS } from '@shared/vocabulary';
import { controlMessage } from '../../../core/forms/control-message';
import type { ClampingGroup, FormContent } from '../recipe-form';
import { InlineChecks } from './inline-checks';
import { offeredOptions } from './offered-options';

/**
 * Clamping: the method (of those the machine has), where the clamps go, and how the part is
 * oriented in them; for a coated material, where the wheel enters and leaves it.
 */
@Component({
  selector: 'kb-clamping-section',
  imports: [InlineChecks, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  template: `
    @let c = group().controls;
    <section class="kb-section" id="sec-clamping" aria-labelledby="h-clamping">
      <h2 id="h-clamping" tabindex="-1">Clamping</h2>
      <kb-inline-checks [checks]="checks()" />
      <mat-form-field class="kb-wide">
        <mat-label>Clamping method</mat-label>
        <mat-select id="f-clamping-method" [formControl]="c.method">
          <mat-option [value]="null">Not chosen yet</mat-option>
          @for (o of options(); track o.value) {
            <mat-option [value]="o.value"
              >{{ o.label }}
              @if (!o.offered) {
                — not on this machine
              }
            </mat-option>
          }
        </mat-select>
        @if (machine()) {
          <mat-hint>The methods {{ machine()!.name }} is equipped with.</mat-hint>
        }
      </mat-form-field>
      <mat-form-field class="kb-wide">
        <mat-label>Clamp placement</mat-label>
        <input matInput id="f-clamping-placement" [formControl]="c.placement" maxlength="500" />
        <mat-hint>Where the clamps go, e.g. "both sides of the cut, 10 mm from it".</mat-hint>
        <mat-error>{{ controlMessage(c.placement.errors) }}</mat-error>
      </mat-form-field>
      <div class="kb-checks">
        <mat-checkbox id="f-clamping-bothSides" [formControl]="c.bothSides">Clamps on both sides of the cut</mat-checkbox>
        <mat-checkbox id="f-clamping-softInserts" [formControl]="c.softInserts">Soft inserts</mat-checkbox>
        <mat-checkbox id="f-clamping-supportBlocks" [formControl]="c.supportBlocks">Support blocks</mat-checkbox>
      </div>
      @if (showWheelPath()) {
        <mat-form-field class="kb-wide">
          <mat-label>Wheel path through the coating</mat-label>
          <mat-select id="f-clamping-wheelPath" [formControl]="c.wheelPath" data-testid="wheel-path">
            <mat-option [value]="null">Not given</mat-option>
            @for (o of wheelPaths; track o.value) {
              <mat-option [value]="o.value">{{ o.label }}</mat-option>
            }
          </mat-select>
          <mat-hint>Cut so the wheel enters through the coating and presses it onto the substrate; leaving through it peels it off.</mat-hint>
        </mat-form-field>
      }
      <mat-form-field class="kb-wide">
        <mat-label>Orientation rule</mat-label>
        <input matInput id="f-clamping-orientationRule" [formControl]="c.orientationRule" maxlength="500" />
        <mat-hint>
          @if (material()?.coated) {
            Optional beside the wheel path, e.g. "coated band up, wheel enters at the top".
          } @else if (material()?.caseHardened) {
            This material has a surface layer: say which way the wheel enters, e.g. "at the tooth tip, towards the core".
          } @else {
            Optional, e.g. "wheel enters through the coating so it is pressed onto the substrate".
          }
        </mat-hint>
        <mat-error>{{ controlMessage(c.orientationRule.errors) }}</mat-error>
      </mat-form-field>
    </section>
  `,
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ClampingSection {
  readonly group = input.required<ClampingGroup>();
  readonly value = input.required<FormContent['clamping']>();
  readonly machine = input<MachineRecord | null>(null);
  readonly material = input<MaterialRecord | null>(null);
  readonly checks = input<readonly CheckResult[]>();

  protected readonly controlMessage = controlMessage;

  protected readonly wheelPaths = WHEEL_PATHS.map((value) => ({ value, label: WHEEL_PATH_LABELS[value] }));
  /** The wheel path is asked for a coated material, and shown wherever one was given (a material changed since). */
  protected readonly showWheelPath = computed(() => this.material()?.coated === true || (this.value().wheelPath ?? null) !== null);

  protected readonly options = computed(() => offeredOptions(CLAMPING_METHODS, this.machine()?.clampingMethods, this.value().method, CLAMPING_METHOD_LABELS));
}

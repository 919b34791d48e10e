import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { CheckResult } from '@shared/recipe-checks';
import { COOLANT_TYPES, COOLANT_TYPE_LABELS } from '@shared/vocabulary';
import { controlMessage } from '../../../core/forms/control-message';
import type { CoolantGroup, FormContent } from '../recipe-form';
import { InlineChecks } from './inline-checks';
import { DecimalInput } from '../../../ui/decimal-input';

/** Coolant: its type, and the concentration and flow where they apply. */
@Component({
  selector: 'kb-coolant-section',
  imports: [DecimalInput, InlineChecks, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  template: `
    @let c = group().controls;
    @let v = value();
    <section class="kb-section" id="sec-coolant" aria-labelledby="h-coolant">
      <h2 id="h-coolant" tabindex="-1">Coolant</h2>
      <kb-inline-checks [checks]="checks()" />
      <div class="kb-row">
        <mat-form-field>
          <mat-label>Coolant</mat-label>
          <mat-select id="f-coolant-type" [formControl]="c.type">
            @for (t of types; track t.value) {
              <mat-option [value]="t.value">{{ t.label }}</mat-option>
            }
          </mat-select>
          @if (v.type === 'dry') {
            <mat-hint>Only where the wheel's maker allows dry cutting.</mat-hint>
          }
        </mat-form-field>
        @if (v.type === 'water-soluble') {
          <mat-form-field>
            <mat-label>Concentration</mat-label>
            <input matInput id="f-coolant-concentrationPct" kbDecimal [formControl]="c.concentrationPct" />
            <span matTextSuffix>% v/v</span>
            <mat-error>{{ controlMessage(c.concentrationPct.errors) }}</mat-error>
          </mat-form-field>
        }
        @if (v.type !== 'dry') {
          <mat-form-field>
            <mat-label>Flow (optional)</mat-label>
            <input matInput id="f-coolant-flowLMin" kbDecimal [formControl]="c.flowLMin" />
            <span matTextSuffix>L/min</span>
            <mat-error>{{ controlMessage(c.flowLMin.errors) }}</mat-error>
          </mat-form-field>
        }
      </div>
    </section>
  `,
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CoolantSection {
  readonly group = input.required<CoolantGroup>();
  readonly value = input.required<FormContent['coolant']>();
  readonly checks = input<readonly CheckResult[]>();

  protected readonly controlMessage = controlMessage;
  protected readonly types = COOLANT_TYPES.map((t) => ({ value: t, label: COOLANT_TYPE_LABELS[t] }));
}

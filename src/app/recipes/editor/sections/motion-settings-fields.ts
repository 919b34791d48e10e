import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MOTION_SETTING_UNITS, settingsOfMotion } from '@shared/motion-settings';
import { type CutMotion, MOTION_SETTING_LABELS, type MotionSetting } from '@shared/vocabulary';
import { controlMessage } from '../../../core/forms/control-message';
import type { CuttingGroup, FormContent } from '../recipe-form';
import { imperialHint } from './imperial-hint';
import { DecimalInput } from '../../../ui/decimal-input';

/** What to give for each motion: one pair or the other, where the motion can be set two ways. */
const MOTION_HINTS: Partial<Record<CutMotion, string>> = {
  'pulsed-plunge': 'Give the advance and retract per pulse, or the pulse times, as the machine is set.',
  rocking: 'Give the swing angle or the stroke, as the machine is set.',
  'turning-specimen': 'How fast the specimen turns while the wheel cuts.',
  'traverse-pass': 'How deep each pass cuts; the passes together cut through the largest part.',
  'stepped-depth': 'How deep each step cuts; the steps together cut through the largest part.',
};

/**
 * The chosen cut motion's own settings (pulse, rocking, specimen speed, depth per pass or
 * step), with their units; a motion without settings shows nothing. Values typed for
 * another motion stay in the form but are not saved.
 */
@Component({
  selector: 'kb-motion-settings-fields',
  imports: [DecimalInput, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    @if (rows().length) {
      <div role="group" aria-label="Settings of the cut motion" data-testid="motion-settings">
        @for (row of rows(); track $index) {
          <div class="kb-row">
            @for (f of row; track f.key) {
              <mat-form-field>
                <mat-label>{{ f.label }}</mat-label>
                <input matInput [id]="'f-cutting-' + f.key" kbDecimal [formControl]="group().controls[f.key]" />
                <span matTextSuffix>{{ f.unit }}</span>
                @if (f.unit === 'mm' && imperialHint(value()[f.key], 'length', imperial()); as hint) {
                  <mat-hint>{{ hint }}</mat-hint>
                }
                <mat-error>{{ controlMessage(group().controls[f.key].errors) }}</mat-error>
              </mat-form-field>
            }
          </div>
        }
      </div>
      @if (hint(); as h) {
        <p class="kb-facts" data-testid="motion-settings-hint">{{ h }}</p>
      }
    }
  `,
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MotionSettingsFields {
  readonly group = input.required<CuttingGroup>();
  readonly value = input.required<FormContent['cutting']>();
  readonly imperial = input(false);

  protected readonly controlMessage = controlMessage;
  protected readonly imperialHint = imperialHint;

  /** The fields two to a row, so a pulse's distances and its times each stay together. */
  protected readonly rows = computed(() => {
    const fields = settingsOfMotion(this.value().cutMotion).map((key: MotionSetting) => ({
      key,
      label: MOTION_SETTING_LABELS[key],
      unit: MOTION_SETTING_UNITS[key],
    }));
    return Array.from({ length: Math.ceil(fields.length / 2) }, (_, i) => fields.slice(2 * i, 2 * i + 2));
  });
  protected readonly hint = computed(() => {
    const motion = this.value().cutMotion;
    return motion ? (MOTION_HINTS[motion] ?? '') : '';
  });
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { CheckResult } from '@shared/recipe-checks';
import type { MachineRecord } from '@shared/stock-types';
import { CUT_MOTIONS, CUT_MOTION_LABELS } from '@shared/vocabulary';
import { controlMessage } from '../../../core/forms/control-message';
import { type CuttingGroup, type FormContent, MOTIONS_WITH_PASSES } from '../recipe-form';
import { imperialHint } from './imperial-hint';
import { InlineChecks } from './inline-checks';
import { MotionSettingsFields } from './motion-settings-fields';
import { offeredOptions } from './offered-options';
import { DecimalInput } from '../../../ui/decimal-input';

/** Speeds and motion: wheel speed, feed, entry feed, the cut motion the machine offers and its settings. */
@Component({
  selector: 'kb-speeds-section',
  imports: [DecimalInput, InlineChecks, MatFormFieldModule, MotionSettingsFields, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './speeds-section.html',
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpeedsSection {
  readonly group = input.required<CuttingGroup>();
  readonly value = input.required<FormContent['cutting']>();
  readonly machine = input<MachineRecord | null>(null);
  readonly imperial = input(false);
  readonly checks = input<readonly CheckResult[]>();

  protected readonly controlMessage = controlMessage;
  protected readonly imperialHint = imperialHint;

  protected readonly motionOptions = computed(() => offeredOptions(CUT_MOTIONS, this.machine()?.cutMotions, this.value().cutMotion, CUT_MOTION_LABELS));
  protected readonly needsPasses = computed(() => {
    const motion = this.value().cutMotion;
    return motion !== null && MOTIONS_WITH_PASSES.includes(motion);
  });
}

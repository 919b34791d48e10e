import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatRadioModule } from '@angular/material/radio';
import { MatSelectModule } from '@angular/material/select';
import type { CheckResult } from '@shared/recipe-checks';
import type { MaterialRecord } from '@shared/stock-types';
import { CUT_ORIENTATIONS, CUT_ORIENTATION_LABELS, HARDNESS_SCALES, MATERIAL_GROUPS, MATERIAL_GROUP_LABELS, SHAPES, SHAPE_LABELS } from '@shared/vocabulary';
import { controlMessage } from '../../../core/forms/control-message';
import type { FormContent, ScopeGroup } from '../recipe-form';
import { imperialHint } from './imperial-hint';
import { InlineChecks } from './inline-checks';
import { DecimalInput } from '../../../ui/decimal-input';

/** Scope: one material or a group with a hardness window, shape, size window and cut orientation. */
@Component({
  selector: 'kb-scope-section',
  imports: [DecimalInput, InlineChecks, MatCheckboxModule, MatFormFieldModule, MatInputModule, MatRadioModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './scope-section.html',
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ScopeSection {
  readonly group = input.required<ScopeGroup>();
  readonly value = input.required<FormContent['scope']>();
  readonly materials = input.required<readonly MaterialRecord[]>();
  /** The chosen material, for its facts under the field. */
  readonly material = input<MaterialRecord | null>(null);
  readonly imperial = input(false);
  readonly checks = input<readonly CheckResult[]>();

  protected readonly controlMessage = controlMessage;
  protected readonly imperialHint = imperialHint;
  protected readonly groups = MATERIAL_GROUPS.map((g) => ({ value: g, label: MATERIAL_GROUP_LABELS[g] }));
  protected readonly groupLabel = MATERIAL_GROUP_LABELS;
  protected readonly scales = HARDNESS_SCALES;
  protected readonly shapes = SHAPES.map((s) => ({ value: s, label: SHAPE_LABELS[s] }));
  protected readonly orientations = CUT_ORIENTATIONS.map((o) => ({ value: o, label: CUT_ORIENTATION_LABELS[o] }));
}

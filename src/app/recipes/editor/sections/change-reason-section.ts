import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { CheckResult } from '@shared/recipe-checks';
import { controlMessage } from '../../../core/forms/control-message';
import { InlineChecks } from './inline-checks';

/** Change reason: why this version differs from the one before (required from version 2 on). */
@Component({
  selector: 'kb-change-reason-section',
  imports: [InlineChecks, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <section class="kb-section" id="sec-change" aria-labelledby="h-change">
      <h2 id="h-change" tabindex="-1">Change reason</h2>
      <kb-inline-checks [checks]="checks()" />
      <mat-form-field class="kb-wide">
        <mat-label>Change reason</mat-label>
        <textarea matInput id="f-changeReason" [formControl]="control()" rows="2"></textarea>
        <mat-hint>
          {{ versionNumber() >= 2 ? 'Required: why this version differs from the one before.' : 'Optional for the first version.' }}
        </mat-hint>
        <mat-error>{{ controlMessage(control().errors) }}</mat-error>
      </mat-form-field>
    </section>
  `,
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeReasonSection {
  readonly control = input.required<FormControl<string>>();
  /** The version being edited (1 for a new recipe). */
  readonly versionNumber = input(1);
  readonly checks = input<readonly CheckResult[]>();

  protected readonly controlMessage = controlMessage;
}

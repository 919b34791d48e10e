import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { controlMessage } from '../../../core/forms/control-message';
import { MarkdownView } from '../../../ui/markdown-view';

/** A Markdown text area with the text rendered beside it as the recipe page will show it. */
@Component({
  selector: 'kb-markdown-field',
  imports: [MarkdownView, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <mat-form-field class="kb-wide">
      <mat-label>{{ label() }}</mat-label>
      <textarea matInput [id]="fieldId()" [formControl]="control()" [rows]="rows()"></textarea>
      <mat-hint>{{ hint() }}</mat-hint>
      <mat-error>{{ controlMessage(control().errors) }}</mat-error>
    </mat-form-field>
    @if (text().trim()) {
      <div class="kb-preview" [attr.aria-label]="previewLabel()" role="region">
        <span class="kb-preview-label">Preview</span>
        <kb-markdown-view [markdown]="text()" />
      </div>
    } @else if (!previewOnlyWithText()) {
      <div class="kb-preview" [attr.aria-label]="previewLabel()" role="region">
        <span class="kb-preview-label">Preview</span>
        <span class="kb-small">Nothing written yet.</span>
      </div>
    }
  `,
  styleUrl: './editor-section.scss',
  host: { class: 'kb-md' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarkdownField {
  readonly control = input.required<FormControl<string>>();
  /** The element id checks and errors lead to, e.g. "f-instructionsMd". */
  readonly fieldId = input.required<string>();
  readonly label = input.required<string>();
  readonly hint = input.required<string>();
  readonly rows = input(4);
  /** The current text (the control's value), for the preview. */
  readonly text = input.required<string>();
  readonly previewLabel = input.required<string>();
  /** Leave the preview out until something is written. */
  readonly previewOnlyWithText = input(false);

  protected readonly controlMessage = controlMessage;
}

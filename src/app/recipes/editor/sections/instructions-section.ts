import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { FormControl } from '@angular/forms';
import type { CheckResult } from '@shared/recipe-checks';
import { InlineChecks } from './inline-checks';
import { MarkdownField } from './markdown-field';

/** Instructions: the operator's steps and the acceptance criteria for the cut face, in Markdown. */
@Component({
  selector: 'kb-instructions-section',
  imports: [InlineChecks, MarkdownField],
  template: `
    <section class="kb-section" id="sec-instructions" aria-labelledby="h-instructions">
      <h2 id="h-instructions" tabindex="-1">Instructions</h2>
      <kb-inline-checks [checks]="checks()" />
      <kb-markdown-field
        [control]="instructions()"
        fieldId="f-instructionsMd"
        label="Steps for the operator"
        hint='Markdown: "1." for numbered steps, **bold**, - lists.'
        [rows]="8"
        [text]="instructionsText()"
        previewLabel="Preview of the steps"
      />
      <h3>Acceptance criteria</h3>
      <kb-markdown-field
        [control]="acceptance()"
        fieldId="f-acceptanceMd"
        label="Acceptance criteria for the cut face"
        hint="E.g. no discoloration; burr at most 0.2 mm."
        [text]="acceptanceText()"
        previewLabel="Preview of the acceptance criteria"
      />
    </section>
  `,
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InstructionsSection {
  readonly instructions = input.required<FormControl<string>>();
  readonly instructionsText = input.required<string>();
  readonly acceptance = input.required<FormControl<string>>();
  readonly acceptanceText = input.required<string>();
  readonly checks = input<readonly CheckResult[]>();
}

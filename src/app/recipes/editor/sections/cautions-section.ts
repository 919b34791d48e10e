import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { FormControl } from '@angular/forms';
import { MatIconModule } from '@angular/material/icon';
import { PRECEDENCE_LINE, STANDARD_CAUTIONS } from '@shared/cautions';
import type { CheckResult } from '@shared/recipe-checks';
import { InlineChecks } from './inline-checks';
import { MarkdownField } from './markdown-field';

/** Cautions: the standard ones every recipe carries (read-only), then the recipe's own. */
@Component({
  selector: 'kb-cautions-section',
  imports: [InlineChecks, MarkdownField, MatIconModule],
  template: `
    <section class="kb-section" id="sec-cautions" aria-labelledby="h-cautions">
      <h2 id="h-cautions" tabindex="-1">Cautions</h2>
      <kb-inline-checks [checks]="checks()" />
      <div class="kb-standard-cautions" data-testid="standard-cautions">
        <p class="kb-small">Shown on every recipe page and bench sheet; they cannot be edited here.</p>
        <ul>
          @for (caution of cautions; track caution.id) {
            <li>
              <strong>{{ caution.title }}.</strong> {{ caution.text }}
              @if (caution.sources.length) {
                <span class="kb-small">({{ caution.sources.join('; ') }})</span>
              }
            </li>
          }
        </ul>
        <p class="kb-precedence"><mat-icon aria-hidden="true">gavel</mat-icon> {{ precedenceLine }}</p>
      </div>
      <kb-markdown-field
        [control]="control()"
        fieldId="f-cautionsMd"
        label="Cautions for this recipe"
        hint="Shown after the standard cautions. Markdown."
        [text]="text()"
        previewLabel="Preview of the recipe cautions"
        [previewOnlyWithText]="true"
      />
    </section>
  `,
  styleUrl: './editor-section.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CautionsSection {
  readonly control = input.required<FormControl<string>>();
  readonly text = input.required<string>();
  readonly checks = input<readonly CheckResult[]>();

  protected readonly cautions = STANDARD_CAUTIONS;
  protected readonly precedenceLine = PRECEDENCE_LINE;
}

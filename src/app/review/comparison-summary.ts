import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { RecipeComparison } from '../../../shared/recipe-types';

/**
 * A plain rendering of a comparison for the review screen: the changed parameters (old → new)
 * and each changed text with its removed and added words marked. The Compare screen has the
 * full view with side-by-side and inline layouts.
 */
@Component({
  selector: 'kb-comparison-summary',
  template: `
    @let c = comparison();
    @if (c.parameters.length) {
      <table class="kb-params" [attr.aria-label]="'Changed parameters, version ' + c.from.version + ' to ' + c.to.version">
        <thead>
          <tr>
            <th scope="col">Parameter</th>
            <th scope="col">Version {{ c.from.version }}</th>
            <th scope="col">Version {{ c.to.version }}</th>
          </tr>
        </thead>
        <tbody>
          @for (p of c.parameters; track p.path) {
            <tr>
              <th scope="row">{{ p.label }}</th>
              <td class="kb-before">{{ p.before }}</td>
              <td class="kb-after">{{ p.after }}</td>
            </tr>
          }
        </tbody>
      </table>
    } @else {
      <p class="kb-muted">No parameter changed.</p>
    }
    @for (t of c.texts; track t.path) {
      <section class="kb-text-change">
        <h4>{{ t.label }}</h4>
        <p class="kb-diff">
          @for (part of t.parts; track $index) {
            @if (part.added) {
              <ins>{{ part.value }}</ins>
            } @else if (part.removed) {
              <del>{{ part.value }}</del>
            } @else {
              <span>{{ part.value }}</span>
            }
          }
        </p>
      </section>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .kb-params {
      border-collapse: collapse;
      width: 100%;
      font: var(--mat-sys-body-medium);
    }
    th,
    td {
      text-align: left;
      padding: 4px 8px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
      vertical-align: top;
    }
    thead th {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-label-medium);
    }
    .kb-before {
      color: var(--mat-sys-on-surface-variant);
    }
    .kb-after {
      font-weight: 500;
    }
    h4 {
      font: var(--mat-sys-title-small);
      margin: 12px 0 4px;
    }
    .kb-diff {
      white-space: pre-wrap;
      margin: 0;
      font: var(--mat-sys-body-medium);
    }
    ins {
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
      text-decoration: underline;
    }
    del {
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
      text-decoration: line-through;
    }
    .kb-muted {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ComparisonSummary {
  readonly comparison = input.required<RecipeComparison>();
}

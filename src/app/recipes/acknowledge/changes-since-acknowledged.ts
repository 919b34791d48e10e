import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { AcknowledgeApi } from '../../core/api/acknowledge-api';
import { ComparisonView } from '../compare/comparison-view';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

/**
 * What changed since the version of this recipe the operator last acknowledged: the
 * comparison, inline and compact, so "read and understood" is about the change. An operator
 * who never acknowledged a version of the recipe is told so, and reads the version as it is.
 */
@Component({
  selector: 'kb-changes-since-acknowledged',
  imports: [ComparisonView, LabDatePipe, MatProgressBarModule],
  template: `
    @if (changes.isLoading()) {
      <mat-progress-bar mode="indeterminate" aria-label="Loading what changed" />
    } @else if (changes.error()) {
      <p class="kb-muted" role="status">What changed could not be loaded. Compare the versions below instead.</p>
    } @else if (changes.hasValue()) {
      @let c = changes.value();
      @if (c.since && c.comparison) {
        <p class="kb-since" data-testid="since">
          Since version {{ c.since.version }}, which you acknowledged on
          <time [attr.datetime]="c.since.acknowledgedAt">{{ c.since.acknowledgedAt | labDate }}</time>:
        </p>
        <kb-comparison-view [comparison]="c.comparison" layout="inline" [headingLevel]="3" />
      } @else {
        <p class="kb-since" data-testid="never-acknowledged">
          You have not acknowledged a version of this recipe before, so there is nothing to compare with: read this version as it is.
        </p>
      }
    }
  `,
  styles: `
    .kb-since {
      margin: 12px 0 4px;
      font-weight: 500;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangesSinceAcknowledged {
  private readonly api = inject(AcknowledgeApi);

  readonly recipeId = input.required<number>();
  readonly version = input.required<number>();

  private readonly asked = computed(() => ({ id: this.recipeId(), v: this.version() }), { equal: (a, b) => a.id === b.id && a.v === b.v });
  protected readonly changes = rxResource({ params: this.asked, stream: ({ params }) => this.api.changesSince(params.id, params.v) });
}

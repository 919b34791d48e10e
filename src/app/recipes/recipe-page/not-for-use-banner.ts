import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { hasAccess } from '@shared/roles';
import { RECIPE_STATUS_LABELS } from '@shared/vocabulary';
import { utcToday } from '../../core/dates/calendar';
import { Session } from '../../core/session/session';

/**
 * For an operator who reaches a superseded or withdrawn version (a specimen trace, an old
 * link or an old sheet): a full-width "not for use" banner naming the version in force and
 * linking to it, so an old version is read as history and never set up at the saw.
 */
@Component({
  selector: 'kb-not-for-use-banner',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  template: `
    @if (shown()) {
      @let v = version();
      <div class="kb-not-for-use" role="note" aria-labelledby="kb-not-for-use-title" data-testid="not-for-use">
        <mat-icon aria-hidden="true">block</mat-icon>
        <p>
          <strong id="kb-not-for-use-title">
            @if (current(); as c) {
              Not for use — the current version is version {{ c.version }}.
            } @else {
              Not for use — {{ v.number }} has no version in use.
            }
          </strong>
          <span class="kb-sub">Version {{ v.version }} of {{ v.number }} is {{ statusWord() }}. Read it as a record of what was used; do not cut with it.</span>
        </p>
        @if (current(); as c) {
          <a matButton="filled" class="kb-touch" [routerLink]="['/recipes', v.recipeId]" [queryParams]="{ v: c.version }">
            <mat-icon>arrow_forward</mat-icon>
            Open version {{ c.version }}
          </a>
        }
      </div>
    }
  `,
  styleUrl: './not-for-use-banner.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotForUseBanner {
  private readonly session = inject(Session);

  /** The version on screen. */
  readonly version = input.required<RecipeVersionDto>();
  /** Every version of the recipe the person may see, to find the one in force. */
  readonly versions = input.required<readonly RecipeVersionDto[]>();

  private readonly today = utcToday();
  /** Approved and in force today; an approved version effective later is not current yet. */
  protected readonly current = computed(() => this.versions().find((x) => x.status === 'approved' && (x.workflow?.effectiveFrom ?? '') <= this.today) ?? null);
  protected readonly shown = computed(() => {
    const status = this.version().status;
    return (status === 'superseded' || status === 'withdrawn') && hasAccess(this.session.roles(), ['operator']);
  });
  protected readonly statusWord = computed(() => RECIPE_STATUS_LABELS[this.version().status].toLowerCase());
}

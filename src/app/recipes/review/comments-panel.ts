import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { ReviewCommentDto } from '@shared/recipe-types';
import { ReviewComments } from './review-comments';

/** Review comments set apart from the page, for the author of a returned version. */
@Component({
  selector: 'kb-comments-panel',
  imports: [MatIconModule, ReviewComments],
  template: `
    <section class="kb-panel" [attr.aria-labelledby]="headingId">
      <h2 [id]="headingId"><mat-icon aria-hidden="true">rate_review</mat-icon>{{ heading() }}</h2>
      @if (hint()) {
        <p class="kb-hint">{{ hint() }}</p>
      }
      <kb-review-comments [recipeId]="recipeId()" [version]="version()" [canAdd]="canAdd()" (loaded)="loaded.emit($event)" />
    </section>
  `,
  styles: `
    .kb-panel {
      margin: 12px 0 16px;
      padding: 12px 16px;
      border: 2px solid var(--mat-sys-tertiary);
      border-radius: var(--mat-sys-corner-medium);
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
    }
    h2 {
      display: flex;
      align-items: center;
      gap: 8px;
      font: var(--mat-sys-title-small);
      margin: 0 0 8px;
    }
    .kb-hint {
      margin: 0 0 8px;
      font: var(--mat-sys-body-medium);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CommentsPanel {
  readonly recipeId = input.required<number>();
  readonly version = input.required<number>();
  readonly heading = input.required<string>();
  readonly hint = input('');
  readonly canAdd = input(false);
  readonly loaded = output<readonly ReviewCommentDto[]>();

  private static next = 0;
  protected readonly headingId = `kb-comments-panel-${CommentsPanel.next++}`;
}

import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RouterLink } from '@angular/router';
import type { RecipeVersionDto } from '@shared/recipe-types';
import { SignatureList } from '../../ui/signature-list';
import { RecipeStatusChip } from '../../ui/recipe-status-chip';
import { LabDatePipe } from '../../core/dates/lab-date-pipe';

/** Every version of a recipe, newest first: status, dates, author, change reason, returned rounds, signatures and links. */
@Component({
  selector: 'kb-recipe-history',
  imports: [LabDatePipe, RecipeStatusChip, RouterLink, SignatureList],
  template: `
    <ol class="kb-history" aria-label="Version history">
      @for (item of versions(); track item.version) {
        @let wf = item.workflow;
        <li class="kb-history-item" [class.kb-current]="item.version === shown()" [attr.data-version]="item.version">
          <div class="kb-history-head">
            <a class="kb-history-version" [routerLink]="['/recipes', item.recipeId]" [queryParams]="{ v: item.version }">Version {{ item.version }}</a>
            <kb-recipe-status-chip [status]="item.status" />
            @if (item.version === shown()) {
              <span class="kb-shown">shown above</span>
            }
            <span class="kb-spacer"></span>
            @if (item.version > 1) {
              <a class="kb-compare" [routerLink]="['/recipes', item.recipeId, 'compare']" [queryParams]="{ from: item.version - 1, to: item.version }"
                >Compare with version {{ item.version - 1 }}</a
              >
            }
          </div>
          <dl class="kb-history-facts">
            <dt>Author</dt>
            <dd>{{ item.createdBy.name }}</dd>
            <dt>Created</dt>
            <dd>
              <time [attr.datetime]="item.createdAt">{{ item.createdAt | labDate }}</time>
            </dd>
            @if (wf?.submittedAt; as at) {
              <dt>Submitted</dt>
              <dd>
                <time [attr.datetime]="at">{{ at | labDate }}</time>
              </dd>
            }
            @if (wf?.effectiveFrom; as on) {
              <dt>Effective from</dt>
              <dd>{{ on | labDate }}</dd>
            }
            @if (wf?.supersededAt; as at) {
              <dt>Superseded</dt>
              <dd>
                <time [attr.datetime]="at">{{ at | labDate }}</time>
              </dd>
            }
            @if (wf?.withdrawnAt; as at) {
              <dt>Withdrawn</dt>
              <dd>
                <time [attr.datetime]="at">{{ at | labDate }}</time>
                @if (wf?.withdrawnReason) {
                  — {{ wf?.withdrawnReason }}
                }
              </dd>
            }
            <dt>Change reason</dt>
            <dd>{{ item.content.changeReason || (item.version === 1 ? 'First version' : '—') }}</dd>
          </dl>
          @if (wf?.returns?.length) {
            <section class="kb-returns" [attr.aria-label]="'Returned rounds of version ' + item.version">
              <p class="kb-returns-title">Returned to its author {{ wf!.returns!.length === 1 ? 'once' : wf!.returns!.length + ' times' }}</p>
              <ol class="kb-returns-list">
                @for (round of wf!.returns!; track $index) {
                  <li data-testid="returned-round">
                    Returned <time [attr.datetime]="round.returnedAt">{{ round.returnedAt | labDate: 'time' }}</time> by {{ round.returnedBy.name }}:
                    <span class="kb-returns-comment">{{ round.comment }}</span>
                  </li>
                }
              </ol>
            </section>
          }
          @if (wf?.signatures?.length) {
            <kb-signature-list [signatures]="wf!.signatures" />
          }
        </li>
      }
    </ol>
  `,
  styles: `
    .kb-history {
      list-style: none;
      margin: 0;
      padding: 16px 0;
      display: grid;
      gap: 12px;
    }
    .kb-history-item {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: var(--mat-sys-corner-medium);
      padding: 10px 16px 12px;
      display: grid;
      gap: 8px;
    }
    .kb-current {
      border-color: var(--mat-sys-primary);
    }
    .kb-history-head {
      display: flex;
      align-items: center;
      flex-wrap: wrap;
      gap: 10px;
    }
    .kb-history-version {
      font: var(--mat-sys-title-small);
    }
    .kb-shown {
      font: var(--mat-sys-label-small);
      color: var(--mat-sys-on-surface-variant);
    }
    .kb-spacer {
      flex: 1;
    }
    .kb-compare {
      font: var(--mat-sys-body-small);
    }
    .kb-history-facts {
      display: grid;
      grid-template-columns: max-content 1fr;
      gap: 2px 16px;
      margin: 0;
      font: var(--mat-sys-body-medium);
    }
    dt {
      color: var(--mat-sys-on-surface-variant);
    }
    dd {
      margin: 0;
    }
    .kb-returns {
      display: grid;
      gap: 4px;
      font: var(--mat-sys-body-medium);
    }
    .kb-returns-title {
      margin: 0;
      color: var(--mat-sys-on-surface-variant);
    }
    .kb-returns-list {
      margin: 0;
      padding-left: 20px;
      display: grid;
      gap: 2px;
    }
    /* A comment written on several lines keeps its lines. */
    .kb-returns-comment {
      white-space: pre-line;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipeHistory {
  /** Newest first, as the API lists them. */
  readonly versions = input.required<readonly RecipeVersionDto[]>();
  /** The version the page shows. */
  readonly shown = input<number | null>(null);
}

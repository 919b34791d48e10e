import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { formatDate } from '@shared/date-format';
import { REVIEW_OVERDUE_LABEL } from '@shared/vocabulary';
import { LabDateFormat } from '../core/dates/lab-date-format';

/** "Review overdue" beside a recipe whose current version's periodic review date has passed (a note, never a block). */
@Component({
  selector: 'kb-review-overdue-chip',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">event_busy</mat-icon>{{ label }}`,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 0 8px 0 6px;
      border-radius: 12px;
      font: var(--mat-sys-label-medium);
      line-height: 22px;
      white-space: nowrap;
      background: var(--mat-sys-error-container);
      color: var(--mat-sys-on-error-container);
    }
    mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
  `,
  host: { class: 'kb-review-overdue', '[attr.title]': 'title()' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewOverdueChip {
  /** The date the review was due (YYYY-MM-DD), shown as a tooltip. */
  readonly dueOn = input<string | null>(null);
  protected readonly label = REVIEW_OVERDUE_LABEL;
  private readonly dates = inject(LabDateFormat);
  protected readonly title = computed(() => {
    const due = this.dueOn();
    return due ? `The periodic review was due on ${formatDate(due, this.dates.format())}` : null;
  });
}

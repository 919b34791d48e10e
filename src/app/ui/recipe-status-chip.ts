import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { RecipeStatus } from '../../../shared/vocabulary';

/** Plain-words status labels, with an icon each so the status never depends on colour alone. */
export const RECIPE_STATUS_INFO: Record<RecipeStatus, { label: string; icon: string }> = {
  draft: { label: 'Draft', icon: 'edit_note' },
  'in-review': { label: 'In review', icon: 'rate_review' },
  returned: { label: 'Returned', icon: 'undo' },
  approved: { label: 'Approved', icon: 'verified' },
  superseded: { label: 'Superseded', icon: 'history' },
  withdrawn: { label: 'Withdrawn', icon: 'block' },
};

/** A recipe version's status as a small labelled chip. */
@Component({
  selector: 'kb-recipe-status-chip',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ info().icon }}</mat-icon>{{ info().label }}`,
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
      border: 1px solid var(--mat-sys-outline-variant);
      background: var(--mat-sys-surface-container);
      color: var(--mat-sys-on-surface);
    }
    mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
    :host(.kb-status-approved) {
      background: var(--mat-sys-primary-container);
      color: var(--mat-sys-on-primary-container);
      border-color: transparent;
    }
    :host(.kb-status-in-review),
    :host(.kb-status-returned) {
      background: var(--mat-sys-tertiary-container);
      color: var(--mat-sys-on-tertiary-container);
      border-color: transparent;
    }
    :host(.kb-status-withdrawn),
    :host(.kb-status-superseded) {
      color: var(--mat-sys-on-surface-variant);
      background: transparent;
    }
  `,
  host: { '[class]': "'kb-status-' + status()" },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipeStatusChip {
  readonly status = input.required<RecipeStatus>();
  protected readonly info = computed(() => RECIPE_STATUS_INFO[this.status()]);
}

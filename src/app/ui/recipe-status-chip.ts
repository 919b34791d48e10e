import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RECIPE_STATUS_LABELS, type RecipeStatus } from '@shared/vocabulary';

/** An icon for each status beside its word, so the status never depends on colour alone. */
const RECIPE_STATUS_ICONS: Record<RecipeStatus, string> = {
  draft: 'edit_note',
  'in-review': 'rate_review',
  returned: 'undo',
  approved: 'verified',
  superseded: 'history',
  withdrawn: 'block',
};

/** A recipe version's status as a small labelled chip. */
@Component({
  selector: 'kb-recipe-status-chip',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ info().icon }}</mat-icon
    >{{ info().label }}`,
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
  protected readonly info = computed(() => ({ icon: RECIPE_STATUS_ICONS[this.status()], label: RECIPE_STATUS_LABELS[this.status()] }));
}

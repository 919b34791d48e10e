import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { RECIPE_STATUS_MARKS } from '@shared/status-colours';
import type { RecipeStatus } from '@shared/vocabulary';

/**
 * A recipe version's status as a small chip: icon, word and colour from the shared status
 * language (shared/status-colours.ts), so the status never depends on colour alone and reads
 * the same here, on the check page and on the bench sheet.
 */
@Component({
  selector: 'kb-recipe-status-chip',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ mark().icon }}</mat-icon
    >{{ mark().label }}`,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 0 8px 0 6px;
      border-radius: 12px;
      font: var(--mat-sys-label-medium);
      font-weight: 500;
      line-height: 22px;
      white-space: nowrap;
      border: 1px solid;
    }
    mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
  `,
  host: {
    '[class]': "'kb-status-chip kb-status-' + status() + ' kb-tone-' + mark().tone",
    '[style.color]': 'mark().ink',
    '[style.background-color]': 'mark().fill',
    '[style.border-color]': 'mark().edge',
  },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipeStatusChip {
  readonly status = input.required<RecipeStatus>();
  protected readonly mark = computed(() => RECIPE_STATUS_MARKS[this.status()]);
}

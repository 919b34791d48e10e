import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CheckSeverity } from '@shared/recipe-checks';
import { CHECK_SEVERITY_MARKS, NO_FINDINGS_MARK, type StatusMark } from '@shared/status-colours';

/** Icon, word and colours for each check severity (blocker, warning, note) from the shared status language. */
export const SEVERITY_INFO: Record<CheckSeverity | 'none', StatusMark> = { ...CHECK_SEVERITY_MARKS, none: NO_FINDINGS_MARK };

/** A check severity as a small chip, icon + word + colour; `null` means no check found anything. */
@Component({
  selector: 'kb-check-severity',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ info().icon }}</mat-icon
    ><span>{{ info().label }}</span>`,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
      padding: 0 8px 0 6px;
      border-radius: 12px;
      border: 1px solid;
      font: var(--mat-sys-label-medium);
      font-weight: 500;
      line-height: 22px;
      white-space: nowrap;
      // In a results grid the chip keeps its own size, at the top of its row.
      justify-self: start;
      align-self: start;
    }
    mat-icon {
      font-size: 16px;
      width: 16px;
      height: 16px;
    }
  `,
  host: {
    '[class]': "'kb-sev-' + (severity() ?? 'none') + ' kb-tone-' + info().tone",
    '[style.color]': 'info().ink',
    '[style.background-color]': 'info().fill',
    '[style.border-color]': 'info().edge',
  },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckSeverityLabel {
  readonly severity = input.required<CheckSeverity | null>();
  protected readonly info = computed(() => SEVERITY_INFO[this.severity() ?? 'none']);
}

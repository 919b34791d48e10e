import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CheckSeverity } from '@shared/recipe-checks';

/** Icon and word for each check severity (blocker, warning, note), so the severity never depends on colour alone. */
export const SEVERITY_INFO: Record<CheckSeverity | 'none', { label: string; icon: string }> = {
  blocker: { label: 'Blocker', icon: 'block' },
  warning: { label: 'Warning', icon: 'warning' },
  note: { label: 'Note', icon: 'info' },
  none: { label: 'No findings', icon: 'check_circle' },
};

/** A check severity as icon + word; `null` means no check found anything. */
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
      font: var(--mat-sys-label-medium);
      white-space: nowrap;
    }
    mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
    :host(.kb-sev-blocker) {
      color: var(--mat-sys-error);
    }
    :host(.kb-sev-warning) {
      color: var(--mat-sys-tertiary);
    }
    :host(.kb-sev-note),
    :host(.kb-sev-none) {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  host: { '[class]': "'kb-sev-' + (severity() ?? 'none')" },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CheckSeverityLabel {
  readonly severity = input.required<CheckSeverity | null>();
  protected readonly info = computed(() => SEVERITY_INFO[this.severity() ?? 'none']);
}

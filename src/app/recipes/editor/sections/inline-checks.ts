import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import type { CheckResult } from '@shared/recipe-checks';

/** The blockers and warnings about one section's fields, repeated at its top so they are seen in context. */
@Component({
  selector: 'kb-inline-checks',
  imports: [MatIconModule],
  template: `
    @for (check of checks() ?? []; track check.id + check.path) {
      <p class="kb-inline-check" [class.kb-inline-blocker]="check.severity === 'blocker'" [attr.data-inline-check]="check.id">
        <mat-icon aria-hidden="true">{{ check.severity === 'blocker' ? 'block' : 'warning' }}</mat-icon>
        <span
          ><strong>{{ check.severity === 'blocker' ? 'Blocker' : 'Warning' }}:</strong> {{ check.message }}</span
        >
      </p>
    }
  `,
  styles: `
    :host {
      display: block;
    }
    .kb-inline-check {
      display: flex;
      gap: 6px;
      margin: 0 0 10px;
      color: var(--mat-sys-on-surface-variant);

      mat-icon {
        flex: none;
        font-size: 20px;
        width: 20px;
        height: 20px;
      }
    }
    .kb-inline-blocker {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class InlineChecks {
  readonly checks = input<readonly CheckResult[] | undefined>([]);
}

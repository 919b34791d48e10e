import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { CUT_OUTCOME_LABELS, type CutOutcome } from '@shared/vocabulary';

/** Icon per outcome; the word always goes beside it, so colour and shape are never the only cue. */
export const CUT_OUTCOME_ICONS: Record<CutOutcome, string> = {
  good: 'check_circle',
  burnt: 'local_fire_department',
  deformed: 'compress',
  'wheel-failure': 'broken_image',
  other: 'help',
};

/** A cut's outcome as icon and word. */
@Component({
  selector: 'kb-cut-outcome',
  imports: [MatIconModule],
  template: `<mat-icon aria-hidden="true">{{ icon() }}</mat-icon
    ><span>{{ label() }}</span>`,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 4px;
    }
    :host([data-outcome='good']) mat-icon {
      color: var(--mat-sys-primary);
    }
    :host(:not([data-outcome='good'])) mat-icon {
      color: var(--mat-sys-error);
    }
    mat-icon {
      font-size: 20px;
      width: 20px;
      height: 20px;
    }
  `,
  host: { '[attr.data-outcome]': 'outcome()' },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CutOutcomeLabel {
  readonly outcome = input.required<CutOutcome>();
  protected readonly icon = computed(() => CUT_OUTCOME_ICONS[this.outcome()]);
  protected readonly label = computed(() => CUT_OUTCOME_LABELS[this.outcome()]);
}

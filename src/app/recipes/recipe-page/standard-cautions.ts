import { ChangeDetectionStrategy, Component } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { NO_SAFETY_CLAIM, PRECEDENCE_LINE, STANDARD_CAUTIONS } from '@shared/cautions';

/** The standard cautions box every recipe page carries: wheels can burst and saws cut fingers, whatever the recipe. */
@Component({
  selector: 'kb-standard-cautions',
  imports: [MatIconModule],
  template: `
    <section class="kb-cautions" aria-labelledby="kb-cautions-title">
      <h2 id="kb-cautions-title"><mat-icon aria-hidden="true">health_and_safety</mat-icon>Standard cautions</h2>
      <p class="kb-precedence">{{ precedence }}</p>
      <ul>
        @for (caution of cautions; track caution.id) {
          <li>
            <strong>{{ caution.title }}.</strong> {{ caution.text }}
            @if (caution.sources.length) {
              <span class="kb-sources">({{ caution.sources.join('; ') }})</span>
            }
          </li>
        }
      </ul>
      <p class="kb-claim">{{ noClaim }}</p>
    </section>
  `,
  styles: `
    .kb-cautions {
      border: 1px solid var(--mat-sys-outline);
      border-left: 6px solid var(--mat-sys-tertiary);
      border-radius: var(--mat-sys-corner-small);
      padding: 12px 16px;
      background: var(--mat-sys-surface-container-low);
    }
    h2 {
      display: flex;
      align-items: center;
      gap: 8px;
      margin: 0 0 4px;
      font: var(--mat-sys-title-medium);
    }
    ul {
      margin: 8px 0;
      padding-left: 1.2em;
      columns: 2 360px;
      column-gap: 32px;
    }
    li {
      break-inside: avoid;
      margin-bottom: 6px;
    }
    .kb-precedence {
      margin: 0;
      font-weight: 500;
    }
    .kb-sources,
    .kb-claim {
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    .kb-claim {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StandardCautions {
  protected readonly cautions = STANDARD_CAUTIONS;
  protected readonly precedence = PRECEDENCE_LINE;
  protected readonly noClaim = NO_SAFETY_CLAIM;
}

import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';
import { type Caution, NO_SAFETY_CLAIM, PRECEDENCE_LINE, standardCautionsFor } from '@shared/cautions';
import type { WheelKind } from '@shared/vocabulary';

/**
 * The cautions box every recipe page carries: wheels can burst and saws cut fingers, whatever
 * the recipe. The cautions this recipe's material, coolant or flags call for come first, each
 * with its basis; the standard ones cite the wheel standard of the recipe's wheel kind.
 */
@Component({
  selector: 'kb-standard-cautions',
  imports: [MatIconModule],
  template: `
    <section class="kb-cautions" aria-labelledby="kb-cautions-title">
      <h2 id="kb-cautions-title"><mat-icon aria-hidden="true">health_and_safety</mat-icon>{{ forRecipe().length ? 'Cautions' : 'Standard cautions' }}</h2>
      <p class="kb-precedence">{{ precedence }}</p>
      @if (forRecipe().length) {
        <h3>For this material and setup</h3>
        <ul class="kb-for-recipe" data-testid="recipe-cautions">
          @for (caution of forRecipe(); track caution.id) {
            <li [attr.data-caution]="caution.id">
              <strong>{{ caution.title }}.</strong> {{ caution.text }}
              @if (caution.sources.length) {
                <span class="kb-sources">(Basis: {{ caution.sources.join('; ') }})</span>
              }
            </li>
          }
        </ul>
        <h3>Standard</h3>
      }
      <ul>
        @for (caution of cautions(); track caution.id) {
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
    h3 {
      margin: 12px 0 0;
      font: var(--mat-sys-title-small);
    }
    ul {
      margin: 8px 0;
      padding-left: 1.2em;
      columns: 2 360px;
      column-gap: 32px;
    }
    ul.kb-for-recipe {
      columns: auto;
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
  /** The recipe's wheel kind: the wheel cautions then cite only its standard (EN 12413 or EN 13236). */
  readonly wheelKind = input<WheelKind | null>(null);
  /** The cautions the recipe's material, coolant or flags call for. */
  readonly forRecipe = input<readonly Caution[]>([]);

  protected readonly cautions = computed(() => standardCautionsFor(this.wheelKind()));
  protected readonly precedence = PRECEDENCE_LINE;
  protected readonly noClaim = NO_SAFETY_CLAIM;
}

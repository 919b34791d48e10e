import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { UnitPreference } from '@shared/api-types';
import { computeRecipe } from '@shared/recipe-computations';
import type { RecipeContent } from '@shared/schemas/recipe';
import { CUT_POWER_LABELS } from '@shared/vocabulary';
import { labLimits } from '../../core/api/lab-limits';
import type { StockNames } from '../../core/api/stock-names';
import { CutPowerPlot } from '../../ui/cut-profile-plot/cut-power-plot';
import { CutPowerFigures } from '../../ui/cut-power-figures/cut-power-figures';

/**
 * The recipe page's cutting power figures and plot, as the editor shows them. They need the
 * lab's specific cutting energies, which the rest of the page does not: the limits are
 * asked for only when this block is shown (the Computed tab).
 */
@Component({
  selector: 'kb-recipe-cut-power',
  imports: [CutPowerFigures, CutPowerPlot],
  template: `
    @if (power(); as p) {
      <div class="kb-power-figures">
        <h2>{{ labels.heading }}</h2>
        <kb-cut-power-figures [power]="p" [units]="units()" />
      </div>
      @if (p.powerProfile; as points) {
        <div class="kb-power-plot">
          <h2>{{ labels.plotTitle }}</h2>
          <kb-cut-power-plot [points]="points" [motorPowerW]="p.motorPowerW" [warningSharePct]="p.warningSharePct" />
        </div>
      }
    }
  `,
  // Laid out like the computed values and the cut profile above it.
  styles: `
    :host {
      display: flex;
      flex-wrap: wrap;
      gap: 24px;
      padding: 16px 0 0;
    }
    .kb-power-figures {
      flex: 1 1 380px;
    }
    .kb-power-plot {
      flex: 1 1 420px;
      max-width: 560px;
    }
    h2 {
      font: var(--mat-sys-title-small);
      margin: 0 0 8px;
      color: var(--mat-sys-primary);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipeCutPower {
  readonly content = input.required<RecipeContent>();
  readonly stock = input.required<StockNames>();
  readonly units = input<UnitPreference>('metric');

  protected readonly labels = CUT_POWER_LABELS;
  private readonly limits = labLimits();

  protected readonly power = computed(() => computeRecipe(this.content(), { ...this.stock(), limits: this.limits(), selectionRows: [] }).cutPower);
}

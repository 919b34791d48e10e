import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { UnitPreference } from '@shared/api-types';
import { NO_SAFETY_CLAIM } from '@shared/cautions';
import { formatHardness } from '@shared/hardness';
import type { CheckResult, CheckSeverity } from '@shared/recipe-checks';
import type { MarkedMaximum, RecipeComputed } from '@shared/recipe-computations';
import { markedMaximumText } from '@shared/spindle-speed';
import { CHECK_SEVERITY_MARKS } from '@shared/status-colours';
import { NO_VALUE, type QuantityKind, formatQuantity } from '@shared/units';
import { CUT_POWER_LABELS } from '@shared/vocabulary';
import { FIELD_INFO } from './recipe-form';
import { CutProfilePlot } from '../../ui/cut-profile-plot/cut-profile-plot';
import { capacityWords } from '../../ui/cutting-geometry/capacity-words';
import { WornWheelValues } from '../../ui/cutting-geometry/worn-wheel-values';
import { CutPowerPlot } from '../../ui/cut-profile-plot/cut-power-plot';
import { CutPowerFigures } from '../../ui/cut-power-figures/cut-power-figures';

/** Icon and word from the shared status language (shared/status-colours.ts). */
const SEVERITY: Record<CheckSeverity, { icon: string; label: string; plural: string }> = {
  blocker: { ...CHECK_SEVERITY_MARKS.blocker, plural: 'blockers' },
  warning: { ...CHECK_SEVERITY_MARKS.warning, plural: 'warnings' },
  note: { ...CHECK_SEVERITY_MARKS.note, plural: 'notes' },
};

/**
 * The editor's side panel: computed values and the checks, as the author types. Every state
 * is said in words and with an icon, never by colour alone. Choosing a check asks the editor
 * to take the author to the field at its path.
 */
@Component({
  selector: 'kb-recipe-live-panel',
  imports: [CutPowerFigures, CutPowerPlot, CutProfilePlot, MatButtonModule, MatIconModule, WornWheelValues],
  templateUrl: './recipe-live-panel.html',
  styleUrls: ['../../ui/value-list.scss', './recipe-live-panel.scss'],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RecipeLivePanel {
  /** Null until the first computation has run. */
  readonly computed = input.required<RecipeComputed | null>();
  readonly checks = input.required<readonly CheckResult[]>();
  readonly units = input<UnitPreference>('metric');
  /** Whether the computed values lag behind the form (the debounce is running). */
  readonly pending = input(false);

  /** The path of the field a chosen check points at. */
  readonly checkChosen = output<string>();

  protected readonly severity = SEVERITY;
  protected readonly noSafetyClaim = NO_SAFETY_CLAIM;
  protected readonly noValue = NO_VALUE;
  protected readonly powerLabels = CUT_POWER_LABELS;

  protected readonly counts = computed(() => {
    const checks = this.checks();
    return (['blocker', 'warning', 'note'] as const).map((s) => ({ severity: s, count: checks.filter((c) => c.severity === s).length }));
  });
  protected readonly blockers = computed(() => this.checks().filter((c) => c.severity === 'blocker').length);
  protected readonly summary = computed(() =>
    this.counts()
      .map(({ severity, count }) => `${count} ${count === 1 ? SEVERITY[severity].label.toLowerCase() : SEVERITY[severity].plural}`)
      .join(' · '),
  );

  protected readonly overSpeed = computed(() => {
    const margin = this.computed()?.speedMarginMs;
    return margin !== null && margin !== undefined && margin < 0;
  });

  /** The capacity in words, with the geometric limit that applies. */
  protected readonly capacity = computed(() => capacityWords(this.computed(), this.units()));

  protected readonly hardness = computed(() => {
    const h = this.computed()?.hardness;
    if (!h) return null;
    const measured = h.measured.min === h.measured.max ? `${h.measured.min} ${h.measured.scale}` : `${h.measured.min}–${h.measured.max} ${h.measured.scale}`;
    let converted: string | null = null;
    if (h.measured.scale !== 'HV' && h.minHv !== null && h.maxHv !== null) {
      converted = Math.round(h.minHv) === Math.round(h.maxHv) ? formatHardness(h.minHv, 'HV') : `${Math.round(h.minHv)}–${formatHardness(h.maxHv, 'HV')}`;
    }
    return { measured, converted, reason: h.reason, caveats: h.caveats };
  });

  /** A value with its unit; imperial beside it for people who asked for both. */
  protected q(value: number | null | undefined, kind: QuantityKind): string {
    return formatQuantity(value, kind, this.units());
  }

  /** Peripheral speed always shows both units: wheels are marked in m/s, many machines in ft/min. */
  protected speed(value: number | null | undefined): string {
    return formatQuantity(value, 'speed', 'metric+imperial');
  }

  /** The wheel's maximum as marked, with the other unit computed from the new diameter. */
  protected marked(value: MarkedMaximum | null | undefined): string {
    return value ? markedMaximumText(value, this.units()) : this.noValue;
  }

  protected abs(value: number): number {
    return Math.abs(value);
  }

  protected fieldLabel(path: string | null): string {
    if (!path) return '';
    for (let parts = path.split('.'); parts.length; parts.pop()) {
      const info = FIELD_INFO[parts.join('.')];
      if (info) return info.label;
    }
    return '';
  }

  protected chooseCheck(check: CheckResult): void {
    if (check.path) this.checkChosen.emit(check.path);
  }
}
